// Eleventy configuration for scatterbook. The datasheet site arrives with the
// site issue; until then this file only names the folders, so that a plain
// `npx @11ty/eleventy` run does nothing surprising.
export default function (eleventyConfig) {
  return { dir: { input: 'content', output: '_site' } };
}
