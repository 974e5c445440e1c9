/** The plan document model: one import for the client session, the relay and the tests. */
export * from './doc-origin';
export * from './doc-layout';
export * from './doc-schema';
export * from './drawn-intent';
export * from './plan-edit-error';
export * from './edit-record';
export * from './plan-to-doc';
export * from './doc-to-plan';
export * from './part-ops';
export * from './signal-ops';
export * from './intent-ops';
export * from './requirement-ops';
export * from './plan-ops';
export * from './plan-undo';
export * from './content-hash';
export * from './diff-plans';
export * from './engineering-notation';
