// Entry of the workbench page: sets up numeric's global, then the app shell.
import './components/bw-app.ts';
