// The page's styles (render-blocking, so index.html's splash is drawn styled), then the app.
// Only the Ionic CSS the components need, not the optional utility sheets.
import '@ionic/react/css/core.css';
import '@ionic/react/css/normalize.css';
import '@ionic/react/css/structure.css';
import '@ionic/react/css/typography.css';
// Atkinson Hyperlegible, bundled: regular and bold, Latin only.
import './theme/fonts.css';
import './theme/variables.css';
import './theme/app.css';
import { afterFirstPaint } from './app/afterFirstPaint';

// The splash paints first, on its own; then the app's code is fetched and run. On a slow line
// that first paint no longer shares the line, or the main thread, with the app's code.
afterFirstPaint(() => void import('./boot'));
