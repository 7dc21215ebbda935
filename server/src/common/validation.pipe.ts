import { type ArgumentMetadata, HttpStatus, ValidationError, ValidationPipe } from '@nestjs/common';
import { AppException } from './app.exception';

interface FieldProblem {
  field: string;
  rules: Record<string, string>;
}

function flatten(errors: ValidationError[], prefix = ''): FieldProblem[] {
  return errors.flatMap((e) => {
    const field = prefix ? `${prefix}.${e.property}` : e.property;
    const own = e.constraints ? [{ field, rules: e.constraints }] : [];
    return [...own, ...flatten(e.children ?? [], field)];
  });
}

/** The one answer to failed validation: 400 `validation-failed`, naming each field and rule. */
export function validationFailed(errors: ValidationError[]): AppException {
  const details = flatten(errors);
  const message = details.flatMap((d) => Object.values(d.rules)).join('; ');
  return new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, details);
}

/**
 * How deep a body or query may nest objects and arrays. Our deepest real input (a sync push:
 * mutations → args → settings → lists → items) is well under it; class-transformer walks a
 * value recursively and overflows the stack on a few thousand levels.
 */
export const MAX_INPUT_DEPTH = 32;

/** Whether a value nests objects or arrays deeper than `limit` (walked without recursion). */
export function nestedDeeperThan(value: unknown, limit: number): boolean {
  const stack: [unknown, number][] = [[value, 0]];
  while (stack.length > 0) {
    const [v, depth] = stack.pop()!;
    if (v === null || typeof v !== 'object') continue;
    if (depth + 1 > limit) return true;
    for (const child of Object.values(v)) stack.push([child, depth + 1]);
  }
  return false;
}

/** Whitelist, refuse unknown fields, transform; errors name the field and the rule. */
class AppValidationPipe extends ValidationPipe {
  override async transform(value: unknown, metadata: ArgumentMetadata): Promise<unknown> {
    if (nestedDeeperThan(value, MAX_INPUT_DEPTH)) {
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'too-deep',
        `Objects and lists may be nested at most ${MAX_INPUT_DEPTH} levels deep`,
      );
    }
    try {
      return (await super.transform(value, metadata)) as unknown;
    } catch (error) {
      if (error instanceof AppException) throw error;
      // A rule that throws on the value itself (class-validator's e-mail rule given a lone
      // UTF-16 surrogate throws URIError) is bad input, not a server fault: 400, never 500.
      throw new AppException(
        HttpStatus.BAD_REQUEST,
        'validation-failed',
        'Some of what was sent cannot be checked (is there a broken character in it?)',
      );
    }
  }
}

export function createValidationPipe(): ValidationPipe {
  return new AppValidationPipe({
    whitelist: true,
    forbidNonWhitelisted: true,
    transform: true,
    exceptionFactory: validationFailed,
  });
}
