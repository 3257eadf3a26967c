import "server-only";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { Readable } from "node:stream";
import { IMAGE_TYPES } from "./image-type";
import { PDF_TYPE } from "./pdf-type";
import type { StoredType } from "./upload-rules";

/**
 * The one place uploaded bytes are kept: a local folder (FILE_STORAGE_DIR, default data/files).
 * Keys are made here from random bytes and the detected type, and every key is checked against
 * that shape before it touches the file system, so nothing a user typed can become a path.
 */

const DEFAULT_FOLDER = path.join("data", "files");
const KEY_PATTERN = /^[0-9a-f]{32}\.(png|jpg|webp|pdf)$/;
const extensionOf = (type: StoredType) => (type === PDF_TYPE ? "pdf" : IMAGE_TYPES[type].extension);

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

/** Where bytes are written before they are whole: a process killed mid-write leaves its part here, never under a key. */
const INCOMING = ".incoming";

/**
 * Writes the bytes under a new key: first to the incoming folder, flushed to disk, then renamed
 * into place (one step on one file system), so a key names whole bytes or nothing.
 */
export async function saveFile(bytes: Uint8Array, contentType: StoredType): Promise<string> {
  const key = `${randomBytes(16).toString("hex")}.${extensionOf(contentType)}`;
  const incoming = path.join(/*turbopackIgnore: true*/ storageFolder(), INCOMING, key);
  await fs.promises.mkdir(path.dirname(incoming), { recursive: true });
  // "wx" never overwrites: a clash of 128 random bits would fail loudly rather than lose a file.
  const handle = await fs.promises.open(incoming, "wx");
  try {
    await handle.writeFile(bytes);
    await handle.sync();
  } finally {
    await handle.close();
  }
  await fs.promises.rename(incoming, pathOf(key));
  return key;
}

/**
 * Removes what no stored row refers to and no upload still needs: files under a key that is not
 * in `referenced`, and parts left in the incoming folder, last changed before `cutoff` (epoch ms).
 * An upload's bytes are stored before its row commits, so the cutoff must lie further back than
 * any upload takes. Answers the names removed.
 */
export async function sweepStore(referenced: ReadonlySet<string>, cutoff: number): Promise<string[]> {
  const folder = storageFolder();
  const removed: string[] = [];
  const sweep = async (directory: string, isLeftover: (name: string) => boolean) => {
    let names: string[];
    try {
      names = await fs.promises.readdir(directory);
    } catch {
      return; // no folder yet: nothing was ever stored
    }
    for (const name of names) {
      if (!isLeftover(name)) continue;
      const file = path.join(/*turbopackIgnore: true*/ directory, name);
      const stat = await fs.promises.stat(file).catch(() => null);
      if (!stat?.isFile() || stat.mtimeMs >= cutoff) continue;
      await fs.promises.rm(file, { force: true });
      removed.push(directory === folder ? name : `${INCOMING}/${name}`);
    }
  };
  await sweep(folder, (name) => isStorageKey(name) && !referenced.has(name));
  await sweep(path.join(/*turbopackIgnore: true*/ folder, INCOMING), () => true);
  return removed;
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
