// Build-time plugins that keep code the first screens never show out of the startup chunks.
// Most work around one-module "barrels": a bundler places a whole module in one chunk, so
// everything a barrel keeps for any screen ends up wherever the barrel is loaded first.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import type { Plugin } from 'vite';

/**
 * Ionic components that are invisible until opened (overlays) or that we never show (ion-nav,
 * which @ionic/react defines eagerly). @ionic/react is one module that imports every
 * component's `defineCustomElement`, so any overlay used anywhere would land in the entry chunk
 * beside IonApp (~30 kB gzipped). These are defined from their own chunks once the page has
 * loaded and the browser is first idle (at most 3 s later), so they do not compete with the
 * first screen's paint. Ionic opens controller overlays (useIonAlert, useIonToast) after
 * `customElements.whenDefined`, and inline ones (IonModal) pass `is-open` as an attribute,
 * which an element defined later still reads; so a sheet opened sooner still opens.
 */
const deferredIonicTags = [
  'ion-action-sheet',
  'ion-alert',
  'ion-loading',
  'ion-modal',
  'ion-nav',
  'ion-popover',
  'ion-toast',
  // Never shown (icons are inline SVG, src/components/Icon.tsx; the tab bar is our own,
  // features/shell/components/TabBar.tsx), but @ionic/react imports them for its IonIcon,
  // IonTabBar and IonTabButton. Imported statically, they kept their own code and what they
  // import (the ripple effect, which screens opened later use) in the startup chunks.
  'ion-icon',
  'ion-tab-bar',
  'ion-tab-button',
];

/**
 * Visible, but only on a job's pages (never the first screens): its chunk is fetched as soon as
 * the app starts, beside the route chunks, so it is defined before a job page can show.
 */
const soonIonicTags = ['ion-back-button'];

const whenLoaded = `const __ppDefineLater = (load, soon) => {
  let started = false;
  return () => {
    if (started) return;
    started = true;
    const run = () => { void load().then((m) => m.defineCustomElement()); };
    if (soon || typeof document === 'undefined') return run();
    const idle = () => typeof requestIdleCallback === 'function'
      ? requestIdleCallback(run, { timeout: 3000 })
      : setTimeout(run, 200);
    if (document.readyState === 'complete') idle();
    else window.addEventListener('load', idle, { once: true });
  };
};
`;

export function deferIonicOverlays(): Plugin {
  return {
    name: 'panelpass:defer-ionic-overlays',
    apply: 'build',
    transform(code, id) {
      if (!/[\\/]@ionic[\\/]react[\\/]dist[\\/]index\.js$/.test(id)) return null;
      let out = code;
      for (const tag of [...deferredIonicTags, ...soonIonicTags]) {
        const pattern = new RegExp(
          `import \\{ defineCustomElement as (defineCustomElement\\$\\w+) \\} from '@ionic/core/components/${tag}\\.js';`,
        );
        if (!pattern.test(out)) {
          // An Ionic upgrade changed its imports: fail the build rather than grow it silently.
          throw new Error(
            `@ionic/react no longer imports ${tag} as expected; update vite.startup.ts`,
          );
        }
        out = out.replace(
          pattern,
          `const $1 = /*@__PURE__*/ __ppDefineLater(() => import('@ionic/core/components/${tag}.js'), ${soonIonicTags.includes(tag)});`,
        );
      }
      return { code: whenLoaded + out, map: null };
    },
  };
}

/**
 * `ionicons/icons` is one module of 1,300 icons as strings; the icons of every screen would
 * ride in whichever chunk loads it first. Rewrites `import { a, b as c } from 'ionicons/icons'`
 * in our sources into one tiny module per icon, so each chunk carries only its own icons.
 */
export function iconPerModule(): Plugin {
  const prefix = '\0panelpass-icon:';
  let icons: Map<string, string> | undefined;
  const iconSource = () => {
    if (!icons) {
      const require = createRequire(import.meta.url);
      // The ES module sits beside the CommonJS one the package exports.
      const esm = join(dirname(require.resolve('ionicons/icons')), 'index.mjs');
      const text = readFileSync(esm, 'utf8');
      icons = new Map(
        [...text.matchAll(/^export const (\w+) = ("(?:[^"\\]|\\.)*");?$/gm)].map(
          (m): [string, string] => [m[1] ?? '', m[2] ?? ''],
        ),
      );
    }
    return icons;
  };
  return {
    name: 'panelpass:icon-per-module',
    apply: 'build',
    enforce: 'pre',
    transform(code, id) {
      if (id.includes('node_modules') || !/\.tsx?$/.test(id) || !code.includes('ionicons/icons')) {
        return null;
      }
      return code.replace(
        /import\s*\{([^}]*)\}\s*from\s*'ionicons\/icons';/g,
        (_all, names: string) =>
          names
            .split(',')
            .map((part) => part.trim())
            .filter(Boolean)
            .map((part) => {
              const [name = part, local = name] = part.split(/\s+as\s+/);
              return `import ${local} from '${prefix}${name}';`;
            })
            .join('\n'),
      );
    },
    resolveId(source) {
      return source.startsWith(prefix) ? source : null;
    },
    load(id) {
      if (!id.startsWith(prefix)) return null;
      const name = id.slice(prefix.length);
      const svg = iconSource().get(name);
      if (svg === undefined) throw new Error(`ionicons/icons has no icon named ${name}`);
      return `export default ${svg};`;
    },
  };
}

/**
 * Ionic components carry the style sheets of both its looks, `ios` and `md`, as string literals
 * (`static get style(){return{ios:'…',md:'…'}}`), and pick one by the mode at run time. The app
 * pins `mode: 'md'` (src/main.tsx, setupIonicReact), so the `ios` sheets are never applied:
 * this empties them at build time. An element given mode="ios" would show unstyled: the
 * pinned mode and this plugin go together (and a unit test checks main.tsx still pins it).
 */

/** The end (index after the closing quote) of the JS string literal starting at `start`. */
function endOfStringLiteral(code: string, start: number): number {
  const quote = code[start];
  if (quote !== "'" && quote !== '"' && quote !== '`') return -1;
  for (let i = start + 1; i < code.length; i++) {
    const c = code[i];
    if (c === '\\') i++;
    else if (quote === '`' && c === '$' && code[i + 1] === '{')
      return -1; // not a plain string
    else if (c === quote) return i + 1;
  }
  return -1;
}

/** `code` with every `ios:'<css>'` of Ionic's style getters emptied; counts what it removed. */
export function dropIosStyles(code: string): { code: string; removed: number } {
  const marker = 'static get style(){return{ios:';
  let out = '';
  let from = 0;
  let removed = 0;
  for (let at = code.indexOf(marker); at !== -1; at = code.indexOf(marker, from)) {
    const literal = at + marker.length;
    const end = endOfStringLiteral(code, literal);
    if (end === -1) break; // an unexpected shape: leave the rest as it is
    out += code.slice(from, literal) + "''";
    removed += end - literal - 2;
    from = end;
  }
  return { code: out + code.slice(from), removed };
}

/**
 * `code` with each component class Ionic builds at the top level (`const b=o(class extends
 * t{…},[…])`, Stencil's proxyCustomElement) marked `/*@__PURE__*\/`; counts them. The call
 * only readies the class its component's `defineCustomElement` registers. Unmarked, it stayed
 * in the bundle for every component @ionic/react imports, even one no screen uses any more
 * (the tab bar and tab buttons: features/shell/components/TabBar.tsx draws its own), since
 * the bundler keeps a module's top-level calls once it keeps the module.
 */
export function markIonicClassesPure(code: string): { code: string; marked: number } {
  let marked = 0;
  const out = code.replace(
    /(^|[;}\n])(const \w+=)(\w+\(class extends \w+\{)/g,
    (_all, before: string, binding: string, call: string) => {
      marked++;
      return `${before}${binding}/*@__PURE__*/${call}`;
    },
  );
  return { code: out, marked };
}

/** Ionic's components, trimmed: the md look only, their classes marked pure (see above). */
export function ionicMdStylesOnly(): Plugin {
  return {
    name: 'panelpass:ionic-md-styles-only',
    apply: 'build',
    transform(code, id) {
      if (!/[\\/]@ionic[\\/]core[\\/]components[\\/][^\\/]+\.js$/.test(id)) return null;
      const { code: styled, removed } = dropIosStyles(code);
      const { code: out, marked } = markIonicClassesPure(styled);
      return removed || marked ? { code: out, map: null } : null;
    },
  };
}

/**
 * Two fixes to @ionic/react's one module, both about code the app does not need at startup:
 *  - It builds some components at the top level without a `/*@__PURE__*\/` mark
 *    (`const IonIcon = createForwardRef(…)`, `const IonNavInner = createReactComponent('ion-nav',
 *    …)`), so the bundler must keep each one, and what it defines, even when the app never uses
 *    it. These calls only build components; marked pure, the unused ones go.
 *  - Its IonIcon defines `<ion-icon>` from the ionicons package, which carries a second copy of
 *    the component runtime (~6 kB gzipped); @ionic/core ships the same element built on its own
 *    runtime (its back button and toasts use that one), so IonIcon takes it from there.
 * Returns the code and how many changes it made; throws when Ionic changed the import it
 * rewrites, so an upgrade cannot quietly bring the second runtime back.
 */
export function trimIonicReact(code: string): { code: string; changes: number } {
  const ioniconsImport = "from 'ionicons/components/ion-icon.js';";
  if (!code.includes(ioniconsImport)) {
    throw new Error(
      '@ionic/react no longer imports ion-icon from ionicons; update vite.startup.ts',
    );
  }
  let changes = 1;
  const out = code
    .replace(ioniconsImport, "from '@ionic/core/components/ion-icon.js';")
    .replace(
      /^(const \w+ = )(createForwardRef|createReactComponent|React\.createContext|React\.memo)\(/gm,
      (_all, head: string, call: string) => {
        changes++;
        return `${head}/*@__PURE__*/ ${call}(`;
      },
    );
  return { code: out, changes };
}

/** The Ionic components the app builds itself (src/components/ionic.ts), not @ionic/react. */
export const ownIonicComponents = [
  'IonButton',
  'IonButtons',
  'IonContent',
  'IonFooter',
  'IonHeader',
  'IonTitle',
  'IonToolbar',
] as const;

/**
 * @ionic/react's module without the components `names`, which the app builds itself
 * (src/components/ionic.ts): their imports of Ionic's elements, their definitions and their
 * exports. Left in, the import alone kept each element in the startup chunks, where the
 * module goes (vite.config.ts startupGroups: a chunk takes what its modules import). Throws
 * when a component is not where it was, so an Ionic upgrade cannot quietly undo this; a
 * build importing one of them from '@ionic/react' fails (no such export).
 */
export function dropIonicReactComponents(code: string, names: readonly string[]): string {
  let out = code;
  const once = (pattern: RegExp, name: string, what: string) => {
    const found = out.match(pattern);
    if (found?.length !== 1) {
      throw new Error(`@ionic/react: ${what} of ${name} not found once; update vite.startup.ts`);
    }
    out = out.replace(pattern, '');
  };
  for (const name of names) {
    once(
      new RegExp(
        `^import \\{ ${name} as ${name}\\$1(, defineCustomElement as defineCustomElement\\$[\\w$]+)? \\} from '@ionic/core/components/ion-[a-z-]+\\.js';\\n`,
        'gm',
      ),
      name,
      'the import',
    );
    once(
      new RegExp(
        `^const ${name} = /\\*@__PURE__\\*/ (createComponent\\(\\{\\n[^]*?\\n\\}\\);|createRoutingComponent\\([^)]*\\);)\\n`,
        'gm',
      ),
      name,
      'the definition',
    );
    once(new RegExp(`(?<=^export \\{[^}\\n]*)\\b${name}, `, 'gm'), name, 'the export');
  }
  return out;
}

/**
 * @ionic/react trimmed (trimIonicReact), without the components the app builds itself
 * (dropIonicReactComponents).
 */
export function trimmedIonicReact(ownComponents: readonly string[] = []): Plugin {
  return {
    name: 'panelpass:trimmed-ionic-react',
    apply: 'build',
    transform(code, id) {
      if (!/[\\/]@ionic[\\/]react[\\/]dist[\\/]index\.js$/.test(id)) return null;
      return {
        code: dropIonicReactComponents(trimIonicReact(code).code, ownComponents),
        map: null,
      };
    },
  };
}

/** What a chunking pass tells about a module: the modules it imports statically. */
export interface StaticGraph {
  getModuleInfo(id: string): { importedIds: readonly string[] } | null;
}

/**
 * `roots` and every module they import statically, directly or not; not through `barrels`,
 * modules that re-export others (see StartupParts.barrels).
 */
export function staticClosure(
  graph: StaticGraph,
  roots: readonly string[],
  barrels: readonly string[] = [],
): Set<string> {
  const isBarrel = (id: string) => {
    const path = id.replaceAll('\\', '/');
    return barrels.some((b) => path.endsWith(`/${b}`));
  };
  const seen = new Set<string>();
  const queue = [...roots];
  for (let id = queue.pop(); id !== undefined; id = queue.pop()) {
    if (seen.has(id) || isBarrel(id)) continue;
    seen.add(id);
    queue.push(...(graph.getModuleInfo(id)?.importedIds ?? []));
  }
  return seen;
}

export interface StartupParts {
  /**
   * The entry and the start (boot.tsx): what they import statically goes in a chunk of its own,
   * `name`, which the entry loads; they stay chunks of their own.
   */
  early: { name: string; roots: readonly string[] };
  /** The parts in the order boot.tsx loads them, each named, by the modules they start from. */
  parts: readonly { name: string; roots: readonly string[] }[];
  /** Screens shown first, one or the other: the code both use goes with `shared`. */
  screens: readonly { name: string; roots: readonly string[] }[];
  shared: string;
  /**
   * Modules that re-export many others (shared/src/index.ts, @ionic/react): the first screens
   * use only some of what they re-export, and what the rest is used by must stay with the
   * screens using it. So they are not followed; the bundler's tree-shaking keeps what the
   * first screens do use, in the chunk of the module using it. Paths, ending module ids.
   */
  barrels?: readonly string[];
}

/** A group of the bundler's code splitting (rolldown's output.codeSplitting.groups). */
export interface StartupGroup {
  name: (id: string, graph: StaticGraph) => string | null;
  debugName: string;
  priority: number;
}

/**
 * The first screens' code in a few chunks. Left to itself the bundler cuts the startup code
 * into some 95 chunks, one per set of lazy screens sharing it; each is a request, and on a
 * phone starting offline every request goes through the service worker, one after another on
 * its thread (measured: the app's scripts arrived over ~600 ms of an offline start). Here it
 * goes in the parts boot.tsx loads side by side and runs one task each (React's DOM renderer,
 * Ionic, the app), then one chunk per first screen. A module goes with the first part that
 * imports it statically, one both screens import with `shared`. A group takes the modules its
 * modules import too, unless a group before it has them: so the groups go in the order they
 * load, each with a higher priority than the next, and no part can pull a later one in.
 */
export function startupChunkGroups(layout: StartupParts): StartupGroup[] {
  const owners = new WeakMap<StaticGraph, Map<string, string>>();
  const ownerOf = (id: string, graph: StaticGraph) => {
    let owner = owners.get(graph);
    if (!owner) {
      owner = startupOwners(layout, graph);
      owners.set(graph, owner);
    }
    return owner.get(id) ?? null;
  };
  const names = [
    layout.early.name,
    ...layout.parts.map((p) => p.name),
    ...new Set([layout.shared, ...layout.screens.map((s) => s.name)]),
  ];
  return [...new Set(names)].map((name, i, all) => ({
    debugName: name,
    priority: all.length - i,
    name: (id, graph) => (ownerOf(id, graph) === name ? name : null),
  }));
}

/** Which startup chunk each module goes in (see startupChunkGroups). */
export function startupOwners(layout: StartupParts, graph: StaticGraph): Map<string, string> {
  const owner = new Map<string, string>();
  const claim = (name: string, ids: Iterable<string>) => {
    for (const id of ids) if (!owner.has(id)) owner.set(id, name);
  };
  const closure = (roots: readonly string[]) => staticClosure(graph, roots, layout.barrels);
  const early = closure(layout.early.roots);
  for (const root of layout.early.roots) early.delete(root);
  claim(layout.early.name, early);
  for (const root of layout.early.roots) owner.set(root, '');
  for (const part of layout.parts) claim(part.name, closure(part.roots));
  const screens = layout.screens.map((s) => ({ name: s.name, ids: closure(s.roots) }));
  claim(
    layout.shared,
    [...(screens[0]?.ids ?? [])].filter((id) => screens.slice(1).some((s) => s.ids.has(id))),
  );
  for (const screen of screens) claim(screen.name, screen.ids);
  for (const root of layout.early.roots) owner.delete(root);
  return owner;
}
