// Eleventy 3 publishes no TypeScript declarations; lib/publish/eleventy-api.ts types what cellbasis uses.
declare module '@11ty/eleventy' {
  export const Eleventy: unknown;
}
