/** The largest profile file accepted, in decimal megabytes: a larger upload answers 413 (lib/read-upload.ts). */
export const MAX_PROFILE_BYTES = 10_000_000;
/** Room for the multipart envelope around the file (boundaries, part headers, other fields). */
export const MULTIPART_SLACK_BYTES = 64 * 1024;
