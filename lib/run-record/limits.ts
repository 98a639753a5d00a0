// Hard caps on a saved run's payload. The encoder keeps within them (decimating snapshots and
// coarsening maps, or refusing when the receiver traces alone are too many); the decoder refuses
// anything beyond them before allocating, so a crafted upload cannot make the server hold more.

const MiB = 1024 * 1024;

/** Largest payload the format admits, compressed (the server's upload limit may be lower). */
export const MAX_RUN_PAYLOAD_BYTES = 128 * MiB;

/** Largest payload once decompressed: the sum of the caps below, rounded up. */
export const MAX_RUN_PAYLOAD_UNCOMPRESSED_BYTES = 256 * MiB;

/** Largest JSON header (it carries the frozen scene, which sampled signals make large). */
export const MAX_RUN_HEADER_BYTES = 16 * MiB;

/** Receiver trace values over all receivers, samples and the three quantities (p, vx, vy): 64 MB of float32. */
export const MAX_TRACE_VALUES = 16 * MiB;

/** Snapshot frames kept at most; more are thinned in time (every k-th kept). */
export const MAX_SNAPSHOT_FRAMES = 1000;

/** Values per snapshot frame at most; larger frames are thinned in space (every s-th cell). */
export const MAX_SNAPSHOT_FRAME_VALUES = 1024 * 1024;

/** Snapshot values over all frames: 96 MB of int16. */
export const MAX_SNAPSHOT_VALUES = 48 * MiB;

/** Values per level or intensity map at most; larger maps are coarsened into blocks of cells. */
export const MAX_MAP_VALUES = 2 * MiB;

/** Receivers named one by one in the summary; a long receiver line is counted, not listed in full. */
export const MAX_SUMMARY_RECEIVERS = 100;
