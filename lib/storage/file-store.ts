import "server-only";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { Readable } from "node:stream";
import { IMAGE_TYPES, type ImageType } from "./image-type";

/**
 * The one place uploaded bytes are kept: a local folder (FILE_STORAGE_DIR, default data/files).
 * Keys are made here from random bytes and the detected type, and every key is checked against
 * that shape before it touches the file system, so nothing a user typed can become a path.
 */

const DEFAULT_FOLDER = path.join("data", "files");
const KEY_PATTERN = /^[0-9a-f]{32}\.(png|jpg|webp)$/;

// The folder is chosen at run time, so the bundler is told not to trace it as a source folder.
function storageFolder(): string {
  return path.resolve(/*turbopackIgnore: true*/ process.env.FILE_STORAGE_DIR || DEFAULT_FOLDER);
}

export function isStorageKey(key: string): boolean {
  return KEY_PATTERN.test(key);
}

function pathOf(key: string): string {
  if (!isStorageKey(key)) throw new Error(`Refusing a storage key of unexpected shape: ${JSON.stringify(key)}`);
  return path.join(/*turbopackIgnore: true*/ storageFolder(), key);
}

export async function saveFile(bytes: Uint8Array, contentType: ImageType): Promise<string> {
  const key = `${randomBytes(16).toString("hex")}.${IMAGE_TYPES[contentType].extension}`;
  await fs.promises.mkdir(storageFolder(), { recursive: true });
  // "wx" never overwrites: a clash of 128 random bits would fail loudly rather than lose a file.
  await fs.promises.writeFile(pathOf(key), bytes, { flag: "wx" });
  return key;
}

/** The stored bytes as a web stream, or null when they are missing. */
export async function readFile(key: string): Promise<ReadableStream<Uint8Array> | null> {
  const file = pathOf(key);
  try {
    await fs.promises.access(file, fs.constants.R_OK);
  } catch {
    return null;
  }
  return Readable.toWeb(fs.createReadStream(file)) as ReadableStream<Uint8Array>;
}

/** Removes the stored bytes; a file already gone is not an error. */
export async function deleteFile(key: string): Promise<void> {
  await fs.promises.rm(pathOf(key), { force: true });
}
