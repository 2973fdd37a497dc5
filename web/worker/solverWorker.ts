// The solver worker: serves the solver's jobs (solverJobs.ts) in the workbench's job protocol,
// off the main thread. One instance per lane of the page's SolverClient.
import { serveJobs } from './serveJobs.ts';
import { solverHandlers } from './solverJobs.ts';
import type { SolverJobs } from './solverProtocol.ts';

serveJobs<SolverJobs>(solverHandlers);
