// Optimisation shared by the designer and the cut planner: one convex quadratic-program solver.
export * from './quadraticProgram.ts';
