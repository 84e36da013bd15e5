/**
 * A map that holds at most `max` entries and, when full, drops the one least recently read or
 * written. Map keeps insertion order, so moving an entry to the end on each use makes the first key
 * the least recently used one.
 */
export class RecentMap<K, V> {
  private readonly entries = new Map<K, V>();

  constructor(readonly max: number) {
    if (!Number.isInteger(max) || max < 1) throw new RangeError(`a RecentMap holds at least one entry, not ${max}`);
  }

  get size(): number {
    return this.entries.size;
  }

  get(key: K): V | undefined {
    if (!this.entries.has(key)) return undefined;
    const value = this.entries.get(key)!;
    this.entries.delete(key);
    this.entries.set(key, value);
    return value;
  }

  set(key: K, value: V): void {
    this.entries.delete(key);
    this.entries.set(key, value);
    if (this.entries.size > this.max) this.entries.delete(this.entries.keys().next().value!);
  }
}
