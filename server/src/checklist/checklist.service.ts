import { Injectable, OnModuleInit } from '@nestjs/common';
import { CommandBus } from '../commands/command-bus.service';
import { command, type CommandContext } from '../commands/command.types';
import { recordOnJob } from '../workspace/field';
import { ChecklistItem } from './checklist-item.entity';
import { ToggleCheckDto } from './dto/checklist.dto';

@Injectable()
export class ChecklistService implements OnModuleInit {
  constructor(private readonly bus: CommandBus) {}

  onModuleInit(): void {
    this.bus.register(
      command({
        name: 'check.toggle',
        args: ToggleCheckDto,
        roles: ['owner', 'tech'],
        run: (c, a) => this.toggle(c, a),
      }),
    );
  }

  /** Done (who and when) or not done; the last write wins. */
  async toggle({ actor, m }: CommandContext, a: ToggleCheckDto): Promise<ChecklistItem> {
    const { row } = await recordOnJob(m, actor, ChecklistItem, a.id, 'Checklist item');
    if (row.done !== a.done) {
      await m.update(
        ChecklistItem,
        { id: row.id },
        a.done
          ? { done: true, doneAt: new Date(), doneBy: actor.userId }
          : { done: false, doneAt: null, doneBy: null },
      );
    }
    return m.findOneByOrFail(ChecklistItem, { id: row.id });
  }
}
