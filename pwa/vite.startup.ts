// Two build-time plugins that keep code the first screens never show out of the startup chunks.
// Both work around one-module "barrels": a bundler places a whole module in one chunk, so
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
