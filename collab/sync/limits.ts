/**
 * Size and rate limits of the live-plan wire protocol. Client and server read the same numbers
 * so a client can refuse to send what the server would refuse to accept.
 */

/**
 * Largest socket.io packet the server accepts (engine.io `maxHttpBufferSize`). A bigger packet
 * makes engine.io drop the socket with only "transport error", so the client must stay below it.
 */
export const MAX_PACKET_BYTES = 2_000_000;

/** Largest single sync or awareness message (`plan:sync` payload). Above it: `too_large`. */
export const MAX_MESSAGE_BYTES = 1_000_000;

/**
 * Largest chunk of the initial document the server sends in one `plan:synced` event. A larger
 * state is split into several sync-step-2 messages, each a valid update on its own.
 */
export const MAX_SYNC_CHUNK_BYTES = 512_000;

/** Largest awareness (presence) message. Presence is small; a big one is a bug or an attack. */
export const MAX_AWARENESS_BYTES = 16_000;

/** Messages a socket may send per second (token bucket refill rate). Above it: `rate_limited`. */
export const MESSAGES_PER_SECOND = 200;

/** Burst a socket may send at once before the rate limit applies. */
export const MESSAGE_BURST = 400;

/** Presence updates forwarded per client per second; extra ones are coalesced into the latest. */
export const AWARENESS_PER_SECOND = 10;

/** Plans one socket may have joined at the same time. */
export const MAX_ROOMS_PER_SOCKET = 16;
