import { HttpStatus, ValidationError, ValidationPipe } from '@nestjs/common';
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

/** Whitelist, refuse unknown fields, transform; errors name the field and the rule. */
export function createValidationPipe(): ValidationPipe {
  return new ValidationPipe({
    whitelist: true,
    forbidNonWhitelisted: true,
    transform: true,
    exceptionFactory: validationFailed,
  });
}
