export * from './types';
export * from './idempotency';
export * from './answer-queue';
export * from './seat-view';
export * from './flow';
export * from './debounce';
export * from './join';
