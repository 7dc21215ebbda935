import { IsEmail, IsObject, IsString } from 'class-validator';
import { AppException } from './app.exception';
import { createValidationPipe, MAX_INPUT_DEPTH, nestedDeeperThan } from './validation.pipe';

class NoteDto {
  @IsString()
  note: string;

  @IsObject()
  record: Record<string, unknown>;
}

class InviteDto {
  @IsEmail()
  email: string;
}

const nest = (levels: number, asArray = false): unknown => {
  let v: unknown = asArray ? [] : {};
  for (let i = 1; i < levels; i++) v = asArray ? [v] : { a: v };
  return v;
};

const body = { type: 'body' as const, metatype: NoteDto, data: '' };

describe('nestedDeeperThan', () => {
  it('counts the levels of objects and arrays, scalars adding none', () => {
    expect(nestedDeeperThan('text', 0)).toBe(false);
    expect(nestedDeeperThan({}, 1)).toBe(false);
    expect(nestedDeeperThan({}, 0)).toBe(true);
    expect(nestedDeeperThan(nest(5), 5)).toBe(false);
    expect(nestedDeeperThan(nest(6), 5)).toBe(true);
    expect(nestedDeeperThan({ a: [1, { b: [2] }] }, 4)).toBe(false);
    expect(nestedDeeperThan({ a: [1, { b: [2] }] }, 3)).toBe(true);
  });

  it('walks a value of a hundred thousand levels without overflowing the stack', () => {
    expect(nestedDeeperThan(nest(100_000, true), MAX_INPUT_DEPTH)).toBe(true);
  });
});

describe('the global validation pipe', () => {
  const pipe = createValidationPipe();

  it('refuses a body nested too deep with 400 too-deep, before class-transformer walks it', async () => {
    const deep = { note: 'x', record: nest(5_000, true) };
    const err = await pipe.transform(deep, body).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppException);
    expect((err as AppException).getResponse()).toEqual({
      statusCode: 400,
      code: 'too-deep',
      message: expect.stringContaining(String(MAX_INPUT_DEPTH)) as unknown,
    });
  });

  it('still takes a body nested up to the limit, and still validates it', async () => {
    const ok = { note: 'x', record: nest(MAX_INPUT_DEPTH - 1) };
    await expect(pipe.transform(ok, body)).resolves.toBeInstanceOf(NoteDto);
    const err = await pipe.transform({ note: 5, record: {} }, body).catch((e: unknown) => e);
    expect((err as AppException).getResponse()).toMatchObject({ code: 'validation-failed' });
  });

  it('answers 400 validation-failed when a rule throws on the value (a lone surrogate in an e-mail)', async () => {
    const invite = { type: 'body' as const, metatype: InviteDto, data: '' };
    const err = await pipe.transform({ email: '\ud800' }, invite).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppException);
    expect((err as AppException).getResponse()).toMatchObject({
      statusCode: 400,
      code: 'validation-failed',
    });
    await expect(pipe.transform({ email: 'ok@example.test' }, invite)).resolves.toBeInstanceOf(
      InviteDto,
    );
  });
});
