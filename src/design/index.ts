// Undercut planning: workshop limits, targets, shape families, optimiser, blank advisor, templates.
export * from './cutLimits.ts';
export * from './designTarget.ts';
export * from './designBar.ts';
export * from './adviseBlankLength.ts';
export * from './whereToCutMap.ts';
export * from './stationTable.ts';
export * from './profileTemplateSvg.ts';
export * from './workshopLimits.ts';
export * from './designBarSolid.ts';
export * from './otherModesClear.ts';
export * from './templatePages.ts';
