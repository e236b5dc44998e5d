import { fetchChoices } from "../../api/fetchChoices.ts";
import { apiGet } from "../../api/http.ts";
import type { ProfileItem, ProfilePage } from "../../api/types/profiles.ts";
import { dataTable } from "../../components/dataTable.ts";
import { el, replaceChildren } from "../../components/el.ts";
import { button, field, select, textInput } from "../../components/formFields.ts";
import { errorNotice, warningNotice } from "../../components/notice.ts";
import { formatPlain } from "../../format/significant.ts";
import { metadataFilter } from "./metadataFilter.ts";
import type { ExclusionOverview, LeftOut } from "../../api/types/inputs.ts";
import { excludeButton, includeButton } from "../../components/exclusionControls.ts";

const PAGE_SIZE = 50;

/** Filters kept while the page is open, so coming back shows the same list. */
const state = { genotype: "", channel: "", meta: "", offset: 0 };

/** The stored embryos grouped by genotype, filtered by genotype, channel and any metadata, a page at a time. */
export function embryoList(): { element: HTMLElement; refresh(): Promise<void> } {
  const genotype = select("genotype", [["", "all genotypes"]]);
  const channel = select("channel", [["", "all channels"]]);
  const meta = textInput("meta", state.meta, "e.g. mounting=lateral");
  const body = el("div", { "data-role": "embryo-list" });

  const refresh = async () => {
    try {
      const choices = await fetchChoices();
      replaceOptions(genotype, [["", "all genotypes"], ...choices.genotypes.map((g): [string, string] => [g, g])], state.genotype);
      replaceOptions(channel, [["", "all channels"], ...choices.channels.map((c): [string, string] => [c, c])], state.channel);
      const filter = metadataFilter(state.meta);
      if (filter.problems.length) {
        replaceChildren(body, warningNotice(`Metadata filter: ${filter.problems.join("; ")}.`, "Write it as KEY=VALUE, e.g. mounting=lateral; separate several with commas."));
        return;
      }
      const [page, exclusions] = await Promise.all([
        apiGet<ProfilePage>("api/profiles", { genotype: state.genotype, channel: state.channel, limit: PAGE_SIZE, offset: state.offset, ...filter.query }),
        apiGet<ExclusionOverview>("api/exclusions"),
      ]);
      replaceChildren(body, table(page, exclusions, () => void refresh(), (e) => replaceChildren(body, errorNotice(e))), pager(page));
    } catch (e) {
      replaceChildren(body, errorNotice(e));
    }
  };

  const apply = () => {
    state.genotype = genotype.value;
    state.channel = channel.value;
    state.meta = meta.value;
    state.offset = 0;
    void refresh();
  };
  genotype.addEventListener("change", apply);
  channel.addEventListener("change", apply);
  meta.addEventListener("change", apply);

  const pager = (page: ProfilePage) => {
    const first = page.total === 0 ? 0 : page.offset + 1;
    const last = Math.min(page.total, page.offset + page.items.length);
    const prev = button("← Previous", () => {
      state.offset = Math.max(0, state.offset - PAGE_SIZE);
      void refresh();
    });
    const next = button("Next →", () => {
      state.offset += PAGE_SIZE;
      void refresh();
    });
    prev.disabled = page.offset === 0;
    next.disabled = last >= page.total;
    return el("div", { class: "pager" }, prev, el("span", { "data-role": "page-info" }, page.total === 0 ? "0 profiles" : `${first}–${last} of ${page.total} profiles`), next);
  };

  const element = el(
    "section",
    { class: "panel", "aria-labelledby": "embryos-title" },
    el("h2", { id: "embryos-title" }, "Stored embryos"),
    el("div", { class: "field-row" }, field("Genotype", genotype), field("Channel", channel), field("Metadata (KEY=VALUE, …)", meta)),
    body,
  );
  return { element, refresh };
}

function replaceOptions(s: HTMLSelectElement, options: [string, string][], value: string): void {
  s.replaceChildren(...options.map(([v, text]) => el("option", { value: v }, text)));
  s.value = options.some(([v]) => v === value) ? value : "";
}

/** The exclusion in force for a profile: of its embryo, or of that profile's channel and time. */
function exclusionOf(p: ProfileItem, ex: ExclusionOverview): LeftOut | undefined {
  return ex.current.find((e) => e.embryo === p.embryo && (e.scope === "embryo" || (e.channel === p.channel && e.time_s === p.timeS)));
}

function table(page: ProfilePage, exclusions: ExclusionOverview, changed: () => void, failed: (e: unknown) => void): HTMLElement {
  return dataTable<ProfileItem>({
    caption: "Profiles by genotype",
    rows: page.items.slice().sort((a, b) => a.genotype.localeCompare(b.genotype) || a.embryo.localeCompare(b.embryo, undefined, { numeric: true }) || a.channel.localeCompare(b.channel)),
    groupBy: (p) => `Genotype ${p.genotype}`,
    rowData: (p) => ({ embryo: p.embryo }),
    csv: { fileName: "profiles.csv" },
    empty: "No stored profiles match these filters.",
    columns: [
      { header: "Embryo", cell: (p) => p.embryo },
      { header: "Genotype", cell: (p) => p.genotype },
      { header: "Channel", cell: (p) => p.channel + (p.timeS !== null ? ` at ${p.timeS} s` : "") },
      { header: "Stage", cell: (p) => p.stage ?? "—" },
      { header: "Age (min)", cell: (p) => formatPlain(p.ageS === null ? null : p.ageS / 60), numeric: true },
      { header: "Length (µm)", cell: (p) => formatPlain(p.lengthUm), numeric: true },
      { header: "Dosage (× wild type)", cell: (p) => formatPlain(p.dosage), numeric: true },
      { header: "Points", cell: (p) => p.nPoints, numeric: true },
      { header: "Range (µm)", cell: (p) => `${formatPlain(p.rangeUm[0])}–${formatPlain(p.rangeUm[1])}`, numeric: true },
      { header: "Reversed", cell: (p) => (p.flipped ? "yes" : "no") },
      { header: "Other metadata", cell: (p) => Object.entries(p.metadata).map(([k, v]) => `${k}=${v}`).join(", ") || "—" },
      { header: "File", cell: (p) => p.fileName },
      {
        header: "In group analyses",
        csv: (p) => {
          const x = exclusionOf(p, exclusions);
          return x ? `excluded: ${x.reason}` : "used";
        },
        cell: (p) => {
          const x = exclusionOf(p, exclusions);
          if (!x) return el("span", {}, "used ", excludeButton({ embryo: p.embryo }, changed, "", p.channel));
          const target = x.scope === "profile" && x.channel ? { embryo: p.embryo, channel: x.channel } : { embryo: p.embryo };
          return el("span", { "data-role": "excluded" }, `excluded${x.scope === "profile" ? " (this channel)" : ""}: ${x.reason} `, includeButton(target, changed, failed));
        },
      },
    ],
  });
}
