import { useEffect, useState } from 'react';

/**
 * A link drawn as a QR code on the phone (a PNG data URL), with the `qrcode` package loaded
 * only when a code is first needed; no network. Undefined while drawing, null for no link or
 * when it could not be drawn (the link text is still shown beside it).
 */
export function useQrCode(text: string | null): string | null | undefined {
  const [drawn, setDrawn] = useState<{ text: string; url: string | null } | null>(null);

  useEffect(() => {
    if (!text) return;
    let live = true;
    import('qrcode')
      // A CommonJS package: the bundler hands its exports over as `default`.
      .then(({ default: qr }) =>
        qr.toDataURL(text, { margin: 2, width: 360, errorCorrectionLevel: 'M' }),
      )
      .then(
        (url) => live && setDrawn({ text, url }),
        () => live && setDrawn({ text, url: null }),
      );
    return () => {
      live = false;
    };
  }, [text]);

  if (!text) return null;
  return drawn?.text === text ? drawn.url : undefined;
}
