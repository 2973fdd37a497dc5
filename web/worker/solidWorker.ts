// The 3D model's worker: serves solidJobs.ts in the workbench's job protocol, off the main thread.
import { serveJobs } from './serveJobs.ts';
import { solidHandlers } from './solidJobs.ts';
import type { SolidJobs } from './solverProtocol.ts';

serveJobs<SolidJobs>(solidHandlers);
