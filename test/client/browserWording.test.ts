import { describe, expect, it } from "vitest";
import { browserWording } from "../../client/format/browserWording.ts";

// common practice, no source: the page names its own fields instead of command-line options.
describe("browserWording", () => {
  it("browserWording replaces the pixel-size option of an import message with the field that sets it", () => {
    expect(browserWording('positions are in pixels, so a pixel size is needed (give --pixel-size in µm, or a "pixel size" column in the side file)')).toBe(
      'positions are in pixels, so a pixel size is needed (give the “Pixel size (µm)” field, or a "pixel size" column in the side file)',
    );
  });

  it("browserWording rewords flip and fit-window hints", () => {
    expect(browserWording("import with --flip auto to reverse such profiles")).toBe("import with Flip “auto” to reverse such profiles");
    expect(browserWording("exclude the plateau with a fit window (e.g. --window 30:), or re-image")).toBe("exclude the plateau with a fit window (e.g. “Window from (µm)” = 30 in the Fits view), or re-image");
  });

  it("browserWording leaves text without options unchanged", () => {
    expect(browserWording("3 empty, NaN or NA cells were dropped")).toBe("3 empty, NaN or NA cells were dropped");
  });
});
