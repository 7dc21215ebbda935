// @vitest-environment node
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { dropIosStyles } from './vite.startup';

const require = createRequire(import.meta.url);

describe('dropIosStyles (the build keeps only the md look of Ionic)', () => {
  it('empties the ios sheet and keeps the md sheet and the rest of the code', () => {
    const code = `x=1;static get style(){return{ios:':host{a:"b\\'c"}',md:':host{d:e}'}}y=2;`;
    const { code: out, removed } = dropIosStyles(code);
    expect(out).toBe(`x=1;static get style(){return{ios:'',md:':host{d:e}'}}y=2;`);
    expect(removed).toBe(`:host{a:"b\\'c"}`.length);
  });

  it('shrinks a real Ionic component and leaves its md sheet byte for byte', () => {
    const file = require.resolve('@ionic/core/components/ion-tab-button.js');
    const code = readFileSync(file, 'utf8');
    const { code: out, removed } = dropIosStyles(code);
    expect(removed).toBeGreaterThan(500);
    expect(out.length).toBe(code.length - removed);
    const md = (s: string) => s.slice(s.indexOf(',md:'));
    expect(md(out)).toBe(md(code));
  });

  it('leaves code without a style getter alone', () => {
    expect(dropIosStyles('const a = 1;')).toEqual({ code: 'const a = 1;', removed: 0 });
  });

  it('goes with the app pinning the md look (src/boot.tsx)', () => {
    const main = readFileSync(new URL('./src/boot.tsx', import.meta.url), 'utf8');
    expect(main).toMatch(/setupIonicReact\(\{[^}]*mode: 'md'/);
  });
});
