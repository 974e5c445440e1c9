/** The live-plan wire contract: events, codec, limits, presence. Origins: `../doc/doc-origin`. */
export * from './errors';
export * from './events';
export * from './limits';
export * from './message-type';
export * from './presence';
export * from './read-only-roles';
export * from './wire-codec';
export * from './chunk-state';
export * from './update-news';
