// Pitch: note names ↔ MIDI numbers ↔ Hz, cents, beats.
export * from './parseNote.ts';
export * from './noteToHz.ts';
export * from './hzToNote.ts';
export * from './cents.ts';
export * from './beatRate.ts';
