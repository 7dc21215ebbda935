import { Foundation1764600000000 } from './migrations/1764600000000-Foundation';
import { BusinessRecords1764600001000 } from './migrations/1764600001000-BusinessRecords';
import { Sync1764600002000 } from './migrations/1764600002000-Sync';
import { HandoverMoney1764600005000 } from './migrations/1764600005000-HandoverMoney';
import { FollowUps1764600015000 } from './migrations/1764600015000-FollowUps';
import { LedgerIndexes1764600023000 } from './migrations/1764600023000-LedgerIndexes';

/** Every migration in order. Append only; never edit one that has landed. */
export const migrations = [
  Foundation1764600000000,
  BusinessRecords1764600001000,
  Sync1764600002000,
  HandoverMoney1764600005000,
  FollowUps1764600015000,
  LedgerIndexes1764600023000,
];
