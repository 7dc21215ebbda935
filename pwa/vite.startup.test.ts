// @vitest-environment node
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import {
  deferIonicOverlays,
  dropIonicReactComponents,
  dropIosStyles,
  markIonicClassesPure,
  ownIonicComponents,
  staticClosure,
  startupChunkGroups,
  startupOwners,
  trimIonicReact,
  type StartupParts,
  type StaticGraph,
} from './vite.startup';

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

describe('dropIonicReactComponents', () => {
  const ionicReact = readFileSync(require.resolve('@ionic/react'), 'utf8');

  it("takes the app's own components out of @ionic/react: imports, definitions, exports", () => {
    const out = dropIonicReactComponents(ionicReact, ownIonicComponents);
    for (const name of ownIonicComponents) {
      expect(out, name).not.toMatch(new RegExp(`\\b${name}\\$1\\b`));
      expect(out, name).not.toMatch(new RegExp(`^const ${name} =`, 'm'));
      expect(out, name).not.toMatch(new RegExp(`^export \\{[^}]*\\b${name}\\b[,} ]`, 'm'));
    }
    // The rest stays: a component beside them, and one whose name starts the same.
    expect(out).toMatch(/^const IonBadge = /m);
    expect(out).toMatch(/\bIonBackButton, IonBackdrop, IonBadge\b/);
    expect(out).toMatch(/\bIonTextarea, IonThumbnail, IonToast\b/);
    expect(ionicReact.length - out.length).toBeGreaterThan(1500);
  });

  it('refuses an @ionic/react where a component is not where it was', () => {
    expect(() => dropIonicReactComponents(ionicReact, ['IonNoSuchThing'])).toThrow(
      /IonNoSuchThing not found once; update vite\.startup\.ts/,
    );
  });

  it('matches what src/components/ionic.ts builds and ESLint keeps from @ionic/react', () => {
    const own = readFileSync(new URL('./src/components/ionic.ts', import.meta.url), 'utf8');
    const built = [...own.matchAll(/^export const (Ion\w+) =/gm)].map((m) => m[1]);
    expect(built.sort()).toEqual([...ownIonicComponents].sort());
    const eslint = readFileSync(new URL('../eslint.config.mjs', import.meta.url), 'utf8');
    for (const name of ownIonicComponents) expect(eslint).toContain(`'${name}'`);
  });
});

describe('markIonicClassesPure', () => {
  it('marks each top-level component class Ionic builds, and nothing else', () => {
    const code =
      'import{d as o,H as t}from"./p-x.js";const b=o(class extends t{render(){return 1}},[289,"ion-a"]);' +
      'const c=o(class extends t{},[1,"ion-b"]),f=()=>o(class extends t{});const d=g(1);';
    const { code: out, marked } = markIonicClassesPure(code);
    expect(marked).toBe(2);
    expect(out).toContain('const b=/*@__PURE__*/o(class extends t{render');
    expect(out).toContain('const c=/*@__PURE__*/o(class extends t{},');
    expect(out).toContain('f=()=>o(class extends t{})'); // not a top-level binding
    expect(out).toContain('const d=g(1);');
  });

  it('finds the class of a real Ionic component', () => {
    const file = require.resolve('@ionic/core/components/ion-tab-bar.js');
    const { code, marked } = markIonicClassesPure(readFileSync(file, 'utf8'));
    expect(marked).toBe(1);
    expect(code).toMatch(/const \w+=\/\*@__PURE__\*\/\w+\(class extends/);
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

describe('deferIonicOverlays', () => {
  const id = require.resolve('@ionic/react');
  const transform = (code: string): string => {
    const hook = deferIonicOverlays().transform;
    if (typeof hook !== 'function') throw new Error('no transform hook');
    const out = (hook as (code: string, id: string) => { code: string } | null).call({}, code, id);
    if (!out) throw new Error('not transformed');
    return out.code;
  };
  const built = transform(trimIonicReact(readFileSync(id, 'utf8')).code);

  it('leaves no static import of an overlay or of the elements the app never shows', () => {
    for (const tag of ['ion-modal', 'ion-toast', 'ion-icon', 'ion-tab-bar', 'ion-tab-button']) {
      expect(built, tag).not.toMatch(new RegExp(`^import [^;]*/${tag}\\.js';`, 'm'));
      expect(built, tag).toContain(`import('@ionic/core/components/${tag}.js')`);
    }
    // What the first screens show stays a static import.
    expect(built).toMatch(/^import [^;]*'@ionic\/core\/components\/ion-app\.js';/m);
  });

  it('refuses an @ionic/react that no longer imports them as it did', () => {
    expect(() => transform("import React from 'react';")).toThrow(/update vite\.startup\.ts/);
  });
});

/** A module graph as the bundler's chunking pass gives it: each module's static imports. */
function graphOf(imports: Record<string, string[]>): StaticGraph {
  return {
    getModuleInfo: (id) => (id in imports ? { importedIds: imports[id] ?? [] } : null),
  };
}

/** A small app shaped like ours: an entry, a start loading three parts, two first screens. */
const app = graphOf({
  '/src/main.tsx': ['/src/access.ts', '/src/boot.tsx'],
  '/src/boot.tsx': ['/nm/react/index.js'],
  '/nm/react-dom/client.js': ['/nm/react-dom/dom.js'],
  '/nm/react-dom/dom.js': ['/nm/react/index.js', '/nm/scheduler/index.js'],
  '/src/startIonic.ts': ['/nm/@ionic/react/dist/index.js'],
  '/nm/@ionic/react/dist/index.js': ['/nm/react-dom/dom.js', '/nm/@ionic/core/app.js'],
  '/src/App.tsx': ['/src/access.ts', '/nm/router/index.js', '/nm/@ionic/react/dist/index.js'],
  '/src/MainTabs.tsx': ['/src/TabBar.tsx', '/src/TextField.tsx'],
  '/src/TabBar.tsx': ['/src/access.ts'],
  '/src/TodayPage.tsx': ['/src/Today.tsx'],
  '/src/Today.tsx': ['/shared/src/index.ts'],
  '/shared/src/index.ts': ['/shared/src/stages.ts', '/shared/src/pricing.ts'],
  '/src/SignInPage.tsx': ['/src/TextField.tsx', '/src/SignInForm.tsx'],
});

const layout: StartupParts = {
  early: { name: 'start', roots: ['/src/main.tsx', '/src/boot.tsx'] },
  parts: [
    { name: 'renderer', roots: ['/nm/react-dom/client.js'] },
    { name: 'ionic', roots: ['/src/startIonic.ts'] },
    { name: 'app', roots: ['/src/App.tsx'] },
  ],
  screens: [
    { name: 'tabs', roots: ['/src/MainTabs.tsx', '/src/TodayPage.tsx'] },
    { name: 'sign-in', roots: ['/src/SignInPage.tsx'] },
  ],
  shared: 'app',
  barrels: ['@ionic/react/dist/index.js', 'shared/src/index.ts'],
};

describe('staticClosure', () => {
  it('follows static imports, not through barrels', () => {
    expect([...staticClosure(app, ['/src/TodayPage.tsx'])].sort()).toEqual([
      '/shared/src/index.ts',
      '/shared/src/pricing.ts',
      '/shared/src/stages.ts',
      '/src/Today.tsx',
      '/src/TodayPage.tsx',
    ]);
    expect([...staticClosure(app, ['/src/TodayPage.tsx'], layout.barrels)].sort()).toEqual([
      '/src/Today.tsx',
      '/src/TodayPage.tsx',
    ]);
  });
});

describe('startupOwners (the first screens in a few chunks)', () => {
  const owners = startupOwners(layout, app);

  it('puts each module with the first part importing it, in the order they load', () => {
    expect(owners.get('/src/access.ts')).toBe('start'); // the entry imports it
    expect(owners.get('/nm/react/index.js')).toBe('start'); // the start imports it
    expect(owners.get('/nm/react-dom/dom.js')).toBe('renderer'); // Ionic imports it too
    expect(owners.get('/nm/scheduler/index.js')).toBe('renderer');
    expect(owners.get('/src/startIonic.ts')).toBe('ionic');
    expect(owners.get('/nm/router/index.js')).toBe('app');
    expect(owners.get('/src/TabBar.tsx')).toBe('tabs');
    expect(owners.get('/src/Today.tsx')).toBe('tabs');
    expect(owners.get('/src/SignInForm.tsx')).toBe('sign-in');
  });

  it('puts what both first screens use with the app, which both load', () => {
    expect(owners.get('/src/TextField.tsx')).toBe('app');
  });

  it('leaves the entry, the start and what only barrels lead to to the bundler', () => {
    for (const id of [
      '/src/main.tsx',
      '/src/boot.tsx',
      '/shared/src/index.ts',
      '/shared/src/pricing.ts',
      '/nm/@ionic/react/dist/index.js',
      '/nm/@ionic/core/app.js',
    ]) {
      expect(owners.has(id), id).toBe(false);
    }
  });
});

describe('startupChunkGroups', () => {
  const groups = startupChunkGroups(layout);

  it('is one group per chunk, earlier ones first (a group takes its imports unless an earlier one has them)', () => {
    expect(groups.map((g) => g.debugName)).toEqual([
      'start',
      'renderer',
      'ionic',
      'app',
      'tabs',
      'sign-in',
    ]);
    const priorities = groups.map((g) => g.priority);
    expect(priorities).toEqual([...priorities].sort((a, b) => b - a));
    expect(new Set(priorities).size).toBe(groups.length);
  });

  it('names only its own modules', () => {
    const tabs = groups.find((g) => g.debugName === 'tabs');
    expect(tabs?.name('/src/TabBar.tsx', app)).toBe('tabs');
    expect(tabs?.name('/src/TextField.tsx', app)).toBeNull();
    expect(tabs?.name('/src/Elsewhere.tsx', app)).toBeNull();
  });
});
