export * from './types';
export { evaluate, stageOf, isOutOfSeason, headlines, shootLabels, WizardInputError } from './engine';
export { ENGINE_VERSION, RULES } from './rules';
export * from './season';
export * from './container';
export * from './feeding';
export { dueNow } from './due-now';
