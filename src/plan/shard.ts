/**
 * Shards of a screen (README, "Scale past one machine"): every station goes to exactly one of n shards
 * by a stable hash of its id, so that n runs of `coldsoak screen --shard k/n` (k = 0 … n − 1), on any
 * machines, together screen every station once. The hash is 32-bit FNV-1a (Fowler, Noll and Vo; the
 * parameters of the IETF draft "The FNV Non-Cryptographic Hash Algorithm", draft-eastlake-fnv) of the
 * id's UTF-8 bytes; the shard is that number modulo n.
 */
import { inputError } from "../errors.js";

/** FNV-1a 32-bit offset basis and prime (draft-eastlake-fnv, section 5). */
const FNV32_OFFSET = 0x811c9dc5;
const FNV32_PRIME = 0x01000193;

/**
 * 32-bit FNV-1a hash of a text's UTF-8 bytes, as an unsigned integer.
 *
 * @param text - the text hashed (a station id "USAF-WBAN")
 * @returns the hash, 0 … 2³² − 1
 * @example fnv1a32("a") // 0xe40c292c (the draft's test vector)
 */
export function fnv1a32(text: string): number {
  let h = FNV32_OFFSET;
  for (const byte of Buffer.from(text, "utf8")) {
    h ^= byte;
    h = Math.imul(h, FNV32_PRIME) >>> 0;
  }
  return h >>> 0;
}

/** Shard k of n. */
export interface Shard {
  index: number;
  count: number;
}

/** The shard (0 … count − 1) a station id goes to. */
export function shardOf(stationId: string, count: number): number {
  return fnv1a32(stationId) % count;
}

/** Most shards of one screen. */
export const MAX_SHARDS = 100_000;

/** Parses `--shard k/n` (k = 0 … n − 1); an error names the option and what is expected. */
export function parseShard(text: string): Shard {
  const m = /^(\d+)\/(\d+)$/.exec(text.trim());
  const index = m ? Number(m[1]) : Number.NaN;
  const count = m ? Number(m[2]) : Number.NaN;
  if (!(count >= 1 && count <= MAX_SHARDS && index >= 0 && index < count))
    throw inputError(
      "--shard",
      undefined,
      undefined,
      `"${text}"; expected k/n with n from 1 to ${MAX_SHARDS} and k from 0 to n − 1 (e.g. 0/8: the first of eight shards)`,
    );
  return { index, count };
}
