import type { ReactNode } from 'react';
import { Glyph, type GlyphName } from './Glyph';

export type NoticeTone = 'stop' | 'wait' | 'done' | 'info';

const glyphFor: Record<NoticeTone, GlyphName> = {
  stop: 'alert',
  wait: 'alert',
  done: 'check',
  info: 'info',
};

/** A message with an icon and words, never colour alone. `stop` is announced at once. */
export function Notice({ tone, children }: { tone: NoticeTone; children: ReactNode }) {
  return (
    <div className={`pp-notice pp-notice--${tone}`} role={tone === 'stop' ? 'alert' : 'status'}>
      <Glyph name={glyphFor[tone]} />
      <p>{children}</p>
    </div>
  );
}
