/**
 * Limits on config files. Hand-written configs are a few kilobytes; the limits only stop input that
 * could not be a config (a wrong file, a generated bomb) before it costs time or memory.
 */

/** Largest config file read, in bytes (1 MiB). */
export const MAX_FILE_BYTES = 1024 * 1024;

/** Deepest nesting of mappings and lists in a config file (our formats need fewer than 10 levels). */
export const MAX_DEPTH = 32;

/** Most jobs one sweep may expand to. */
export const MAX_SWEEP_JOBS = 10_000;

/** Keys refused anywhere in a config file: they name JavaScript object internals. */
export const FORBIDDEN_KEYS: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);
