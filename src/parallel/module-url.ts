// Module URLs that work both from the built JavaScript (dist) and from the TypeScript sources (tests).

/** True when `importMetaUrl` is a TypeScript source, as when the tests run the sources directly. */
export function isSourceModule(importMetaUrl: string): boolean {
  return importMetaUrl.endsWith('.ts');
}

/** URL of the sibling module `baseName` of the module at `importMetaUrl`, with the same extension. */
export function siblingModule(importMetaUrl: string, baseName: string): string {
  return new URL(`./${baseName}${isSourceModule(importMetaUrl) ? '.ts' : '.js'}`, importMetaUrl).href;
}
