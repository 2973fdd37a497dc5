// Pitch: note names to Hz, Hz to the nearest note, cents, beats (note-name syntax and the A4
// reference are on the file-format floor: src/fileFormats/noteName.ts, concertPitch.ts).
export * from './noteToHz.ts';
export * from './hzToNote.ts';
export * from './cents.ts';
export * from './beatRate.ts';
