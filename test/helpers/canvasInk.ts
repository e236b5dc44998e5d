import type { Locator } from "playwright-core";

/**
 * How much a canvas has drawn: the share of pixels that are not the white
 * background, the number of distinct colours among them, and how many are
 * close to one series colour (deep blue, the first colour of
 * client/figures/palette.ts, by default). A chart that failed to draw is all
 * white (or transparent); one that drew only its axes has no series pixels.
 */
export async function canvasInk(canvas: Locator, seriesHex = "#1b5e9e"): Promise<{ inkFraction: number; colours: number; seriesPixels: number; width: number; height: number }> {
  return canvas.evaluate((node, hex) => {
    const target = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
    let seriesPixels = 0;
    const c = node as HTMLCanvasElement;
    const ctx = c.getContext("2d")!;
    const { data } = ctx.getImageData(0, 0, c.width, c.height);
    let ink = 0;
    const colours = new Set<number>();
    for (let i = 0; i < data.length; i += 4) {
      const [r, g, b, a] = [data[i], data[i + 1], data[i + 2], data[i + 3]];
      if (a > 0 && (r < 245 || g < 245 || b < 245)) {
        ink++;
        if (colours.size < 1000) colours.add((r << 16) | (g << 8) | b);
        // Antialiased edges blend with the background, so allow some distance from the exact colour.
        if (Math.abs(r - target[0]) < 40 && Math.abs(g - target[1]) < 40 && Math.abs(b - target[2]) < 40) seriesPixels++;
      }
    }
    return { inkFraction: ink / (c.width * c.height), colours: colours.size, seriesPixels, width: c.width, height: c.height };
  }, seriesHex);
}
