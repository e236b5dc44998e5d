import type { CommandIo } from "./command.ts";

/**
 * Progress for long commands: a single updating line on stderr when stderr is
 * a terminal, nothing otherwise (and never anything on stdout).
 */
export function progressReporter(io: CommandIo, label: string): { update: (fraction: number, stage: string) => void; done: () => void } {
  if (!io.stderrIsTty) return { update: () => {}, done: () => {} };
  let last = -1;
  return {
    update(fraction, stage) {
      const pct = Math.round(fraction * 100);
      if (pct === last) return;
      last = pct;
      io.stderr(`\r${label}: ${String(pct).padStart(3)}%  ${stage}`.padEnd(70));
    },
    done() {
      io.stderr("\r".padEnd(72) + "\r");
    },
  };
}
