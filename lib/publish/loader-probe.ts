/**
 * A module with no content of its own: .eleventy.js imports it to learn whether TypeScript can
 * be imported already (tsx registered by bin/cellbasis.js) before it registers tsx itself.
 */
export {};
