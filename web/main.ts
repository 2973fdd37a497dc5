// Entry of the workbench page: the app shell, and (in the built app) the service worker that
// keeps the workbench working offline and offers new versions (web/offline/).
import './components/bw-app.ts';
import { registerServiceWorker } from './offline/appUpdates.ts';

// Stamped for support and tests: which version of the workbench this page runs.
document.documentElement.dataset.version = __BARWRIGHT_VERSION__;

// Only the built app (`npm start`) caches itself: the development server (`npm run dev`) must
// always serve the files as they are being edited.
if (import.meta.env.PROD && 'serviceWorker' in navigator) void registerServiceWorker(new URL('sw.js', document.baseURI));
