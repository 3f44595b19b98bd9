import crypto from 'node:crypto';

/** Lower-case hex SHA-256 of some bytes (as the photo intake computes it). */
export const sha256Of = (bytes: Buffer): string => crypto.createHash('sha256').update(bytes).digest('hex');
