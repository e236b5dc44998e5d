import { ApiError } from "../api/apiError.ts";
import type { JobView } from "../api/types/job.ts";
import { watchJob } from "../api/watchJob.ts";
import { formatPercent } from "../format/formatPercent.ts";
import { el, replaceChildren } from "./el.ts";
import { button } from "./formFields.ts";
import { errorNotice, infoNotice } from "./notice.ts";

/**
 * Start a background analysis and show its progress (percent and stage) with
 * a Cancel button in `container`. Resolves with the job's result, or null when
 * it failed or was cancelled (the reason is then shown in `container`).
 */
export async function runJob<R>(container: HTMLElement, title: string, start: () => Promise<JobView>): Promise<R | null> {
  const bar = el("progress", { max: 100, value: 0, "aria-label": `${title}: progress` });
  const percent = el("span", { class: "job-percent" }, "0%");
  const stage = el("span", { class: "job-stage" }, "starting");
  const cancel = button("Cancel", () => void stop(), "secondary", { "data-role": "cancel-job" });
  const box = el("div", { class: "job-progress", role: "status", "aria-live": "polite", "data-status": "starting" }, el("strong", {}, title), bar, percent, stage, cancel);
  replaceChildren(container, box);

  let watch: ReturnType<typeof watchJob<R>> | null = null;
  const stop = async () => {
    cancel.disabled = true;
    stage.textContent = "cancelling…";
    try {
      await watch?.cancel();
    } catch (e) {
      replaceChildren(container, errorNotice(e));
    }
  };
  const show = (job: JobView) => {
    bar.value = Math.round(job.progress.fraction * 100);
    percent.textContent = formatPercent(job.progress.fraction);
    stage.textContent = job.progress.etaS !== undefined && job.status === "running" ? `${job.progress.stage} · about ${timeLeft(job.progress.etaS)} left` : job.progress.stage;
    box.dataset.status = job.status;
  };

  try {
    watch = watchJob<R>(await start(), show);
    const result = await watch.result;
    cancel.remove();
    return result;
  } catch (e) {
    if (e instanceof ApiError && e.code === "cancelled") replaceChildren(container, infoNotice(e.message));
    else replaceChildren(container, errorNotice(e));
    return null;
  }
}

/** "40 s", "3 min", "2.5 h": a rough estimate, said roughly. */
function timeLeft(s: number): string {
  if (s < 90) return `${Math.max(1, Math.round(s))} s`;
  if (s < 5400) return `${Math.round(s / 60)} min`;
  return `${(s / 3600).toFixed(1)} h`;
}
