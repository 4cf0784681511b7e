import type { Web } from '@seinework/contracts';

/**
 * The webs of recently read versions, kept in memory: a version's web never changes once saved
 * (every save is a new version), so a cached copy can never be stale, whichever server wrote it.
 * Least recently used versions leave first.
 */
export class VersionWebCache {
  private readonly webs = new Map<string, Web>();

  constructor(private readonly capacity = 200) {}

  async get(versionId: string, read: () => Promise<Web>): Promise<Web> {
    const cached = this.webs.get(versionId);
    if (cached) {
      this.webs.delete(versionId);
      this.webs.set(versionId, cached);
      return cached;
    }
    const web = await read();
    this.webs.set(versionId, web);
    if (this.webs.size > this.capacity) this.webs.delete(this.webs.keys().next().value!);
    return web;
  }
}
