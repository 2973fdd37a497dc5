// The file-format floor: what barwright reads and writes (bar, session, keyboard and chime-set
// files; note names and the A4 reference as files give them; material preset names; workshop
// limits in millimetres) with their validating parsers, and InputError. Every other floor may
// import from here; this floor imports nothing of barwright's.
export * from './InputError.ts';
export * from './roundDecimals.ts';
export * from './noteName.ts';
export * from './concertPitch.ts';
export * from './materialPresetNames.ts';
export * from './cutLimitsInput.ts';
export * from './barFileMaterial.ts';
export * from './barFile.ts';
export * from './sessionFile.ts';
export { otherModeCeilingHz, otherModeHz } from './sessionFileSteps.ts';
export * from './sessionLogEdits.ts';
export * from './lotFile.ts';
export * from './keyboardFileTypes.ts';
export * from './keyboardFile.ts';
export * from './chimeSetFile.ts';
export * from './woodConstants.ts';
export * from './workshopFile.ts';
