import type { ClassConstructor } from 'class-transformer';
import type { EntityManager } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import type { Role } from '../users/user.entity';

/** What a command runs with: who asks, the transaction it writes in, and where it came from. */
export interface CommandContext {
  actor: Actor;
  m: EntityManager;
  /** `rest`, or the id of the syncing client. */
  via: string;
}

/**
 * A named domain change (`job.setStage`, `pass.log`…). REST controllers and the sync push
 * both run commands through the CommandBus, so each change is written once.
 */
export interface CommandDef<A extends object = object, R = unknown> {
  name: string;
  args: ClassConstructor<A>;
  roles: readonly Role[];
  /**
   * False only for a command that removes the business itself (`business.delete`): an entry
   * kept under a business that no longer exists would be a row of it left behind.
   */
  audited?: boolean;
  /**
   * True for a command that calls a service outside the database (the card provider): what
   * it did there is not undone when its transaction rolls back. The sync push never runs such
   * a command in a chunk it may roll back and run again (see `SyncService.push`).
   */
  reachesOutside?: boolean;
  run(ctx: CommandContext, args: A): Promise<R>;
}

export function command<A extends object, R>(def: CommandDef<A, R>): CommandDef<A, R> {
  return def;
}
