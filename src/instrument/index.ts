// Keyboards, chimes and bell bars: set-level planning on top of the solver, the designer and the
// resonator code. Browser-safe: the Node worker pool is left out on purpose (its public index
// is index.node.ts); a browser runs runKeyboardTask in web workers.
export * from './lengthForFrequency.ts';
export * from './endLoad.ts';
export * from './pieceModes.ts';
export * from './strikeNote.ts';
export * from './musicalInterval.ts';
export * from './chimeStock.ts';
export * from './analyzeChime.ts';
export * from './chimeForNote.ts';
export * from './cuttingPlan.ts';
export * from './chimeSetPlan.ts';
export * from './chimeCutListCsv.ts';
export * from './bellBarForNote.ts';
export * from './workshopCautions.ts';
export * from './csvTable.ts';
export * from './stableHash.ts';
export * from './smoothLengths.ts';
export * from './keyboardNotes.ts';
export * from './keyboardBlankAdvice.ts';
export * from './blankSchedule.ts';
export * from './keyboardBarJobs.ts';
export * from './keyboardBarResult.ts';
export * from './designKeyboardBar.ts';
export * from './keyboardTask.ts';
export * from './runBatch.ts';
export * from './planKeyboard.ts';
export * from './keyboardCutListCsv.ts';
export * from './keyboardBarTemplates.ts';
export * from './tuneBellBarOvertone.ts';
