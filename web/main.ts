// Entry of the workbench page: sets up numeric's global, then the app shell.
import './numericShim.ts';
import './components/bw-app.ts';
