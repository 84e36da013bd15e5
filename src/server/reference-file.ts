/**
 * Reads a reference-data file (a table that ships with the app under reference-data/) once per
 * process and hands its text to a pure parser from src/lib. The crop table and the retention
 * factors are both loaded this way: the file never changes while the server runs, so reading it
 * again would only cost time, and a file that cannot be read stops the caller with a sentence
 * naming the file and how to restore it rather than working from a missing table.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';

/** Where a reference file lives: reference-data/<name> under the project root (the working directory). */
export function referenceFilePath(name: string, root = process.cwd()): string {
  return resolve(root, 'reference-data', name);
}

/** What a loader needs: the file's name under reference-data/, a label for errors, and its parser. */
export interface ReferenceFileOptions<T> {
  /** The file name under reference-data/, e.g. 'crops.csv'. */
  name: string;
  /** What the file is, for the error sentence, e.g. 'crop table'. */
  label: string;
  /** The pure parser that checks the text and builds the value (throws a sentence on a broken file). */
  parse: (text: string) => T;
}

/**
 * A loader that reads and parses the file once per path per process, then answers from memory.
 * Example: `referenceFileLoader({ name: 'crops.csv', label: 'crop table', parse })()` → parsed rows
 */
export function referenceFileLoader<T>(options: ReferenceFileOptions<T>): (file?: string) => T {
  const cache = new Map<string, T>();
  return (file = referenceFilePath(options.name)) => {
    const cached = cache.get(file);
    if (cached !== undefined) return cached;
    let text: string;
    try {
      text = readFileSync(file, 'utf8');
    } catch (error) {
      const reason = error instanceof Error ? error.message : String(error);
      throw new Error(`The ${options.label} ${file} cannot be read (${reason}): run the server from the project root or restore reference-data/${options.name}.`);
    }
    const value = options.parse(text);
    cache.set(file, value);
    return value;
  };
}
