#!/usr/bin/env node
// Launcher for the barwright command line: registers the TypeScript loader (tsx) so the CLI runs
// straight from a checkout after `npm install`, with no build step, then hands over to main.ts.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('./main.ts');
process.exitCode = await main(process.argv.slice(2));
