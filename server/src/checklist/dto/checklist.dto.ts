import { IsBoolean, IsUUID } from 'class-validator';

export class ToggleCheckBodyDto {
  @IsBoolean({ message: 'done must be true or false' })
  done: boolean;
}

/** `check.toggle`: ticks or unticks one checklist item (last write wins per item). */
export class ToggleCheckDto extends ToggleCheckBodyDto {
  @IsUUID()
  id: string;
}
