// The project document: the workbench's whole keyboard in one file (`*.project.json`) — its types,
// schema, migrations and pure edits, the keyboard file derived from it and the plan stored in it.
// The top floor of src/: only the workbench (web/) builds on it.
export * from './projectFile.ts';
export * from './projectFileTypes.ts';
export { migrateProjectFile } from './projectFileMigrations.ts';
export { formatFieldPath } from './projectFileIssues.ts';
export * from './projectFileEdits.ts';
export * from './projectCutEdits.ts';
export * from './blankRanges.ts';
export * from './projectSetup.ts';
export * from './projectBarEdits.ts';
export * from './projectResonators.ts';
export * from './projectFileTargets.ts';
export * from './projectKeyboardFile.ts';
export * from './projectKeyboardPlan.ts';
export * from './projectKeyboardPlanEdits.ts';
export * from './storePlanInProject.ts';
export * from './projectSessionContext.ts';
export * from './projectTemperatureDrift.ts';
export * from './projectLengthTrim.ts';
export * from './projectChimeSet.ts';
export * from './projectChimeSetPieces.ts';
export * from './projectWorkshop.ts';
