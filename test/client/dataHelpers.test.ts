import { describe, expect, it } from "vitest";
import { guessFileRole } from "../../client/views/data/fileRole.ts";
import { metadataFilter } from "../../client/views/data/metadataFilter.ts";

// common practice, no source
describe("metadataFilter", () => {
  it("metadataFilter turns KEY=VALUE pairs into meta.KEY query parameters", () => {
    expect(metadataFilter("mounting=lateral, stage = S11")).toEqual({ query: { "meta.mounting": "lateral", "meta.stage": "S11" }, problems: [] });
  });

  it("metadataFilter keeps an empty value and reports pairs without a key", () => {
    expect(metadataFilter("note=, lateral, =x")).toEqual({ query: { "meta.note": "" }, problems: ['"lateral" is not KEY=VALUE', '"=x" is not KEY=VALUE'] });
  });

  it("metadataFilter of blank text is no filter", () => {
    expect(metadataFilter("  ")).toEqual({ query: {}, problems: [] });
  });
});

describe("guessFileRole", () => {
  it("guessFileRole takes files named like a metadata side file as metadata and others as profiles", () => {
    expect(guessFileRole("glimmerin_wide_meta.csv")).toBe("meta");
    expect(guessFileRole("Metadata.tsv")).toBe("meta");
    expect(guessFileRole("glimmerin_wide.csv")).toBe("profiles");
  });
});
