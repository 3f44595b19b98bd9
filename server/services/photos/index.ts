/** Shared photo intake: see photo-intake.ts. */
export * from './photo-intake';
