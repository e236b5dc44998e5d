import { escapeHtml } from "./escapeHtml.ts";

/** The settings behind a result, shown in full as JSON under a summary line. */
export function settingsBlock(summary: string, settings: unknown): string {
  return `<details class="settings"><summary>${escapeHtml(summary)}</summary><pre>${escapeHtml(JSON.stringify(settings, null, 2))}</pre></details>`;
}
