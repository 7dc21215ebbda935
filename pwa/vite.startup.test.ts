// @vitest-environment node
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { dropIosStyles, trimIonicReact } from './vite.startup';

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

  it('goes with the app pinning the md look (src/app/startIonic.ts)', () => {
    const main = readFileSync(new URL('./src/app/startIonic.ts', import.meta.url), 'utf8');
    expect(main).toMatch(/setupIonicReact\(\{[^}]*mode: 'md'/);
  });
});

describe('trimIonicReact', () => {
  const sample = [
    "import { defineCustomElement as defineCustomElement$1k } from 'ionicons/components/ion-icon.js';",
    "const IonIconInner = /*@__PURE__*/ createReactComponent('ion-icon', undefined, undefined, defineCustomElement$1k);",
    "const IonNavInner = createReactComponent('ion-nav', undefined, undefined, defineCustomElement$1l);",
    "const IonIcon = createForwardRef(IonIconContainer, 'IonIcon');",
    'const IonTabsContext = React.createContext({',
    '    const inner = createForwardRef(x);',
  ].join('\n');

  it('takes ion-icon from Ionic core and marks the unmarked top-level component builders pure', () => {
    const { code, changes } = trimIonicReact(sample);
    expect(code).toContain("from '@ionic/core/components/ion-icon.js';");
    expect(code).not.toContain('ionicons/components');
    expect(code).toContain("const IonNavInner = /*@__PURE__*/ createReactComponent('ion-nav'");
    expect(code).toContain(
      "const IonIcon = /*@__PURE__*/ createForwardRef(IonIconContainer, 'IonIcon');",
    );
    expect(code).toContain('const IonTabsContext = /*@__PURE__*/ React.createContext({');
    // Already marked, or not at the top level: left as they were.
    expect(code).toContain("const IonIconInner = /*@__PURE__*/ createReactComponent('ion-icon'");
    expect(code).not.toContain('/*@__PURE__*/ /*@__PURE__*/');
    expect(code).toContain('    const inner = createForwardRef(x);');
    expect(changes).toBe(4);
  });

  it('applies to the installed @ionic/react', () => {
    const installed = readFileSync(require.resolve('@ionic/react'), 'utf8');
    const { code, changes } = trimIonicReact(installed);
    expect(code).not.toContain('ionicons/components');
    expect(changes).toBeGreaterThan(1);
  });

  it('refuses an @ionic/react that no longer imports ion-icon from ionicons', () => {
    expect(() => trimIonicReact('const a = 1;')).toThrow(/update vite\.startup\.ts/);
  });
});
