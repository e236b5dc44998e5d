import { UserError } from "../../userError.ts";
import type { PrecisionGroupResponse, PrecisionSummary } from "./precisionResponse.ts";

/** One channel's summary; the first channel's also carries the joint σ_x of all channels. */
export type PrecisionChannelSummary = PrecisionSummary & { joint?: PrecisionGroupResponse["joint"] };

/** One channel's summary of a precision answer: the first channel (with the joint σ_x) unless another is named. */
export function precisionChannel(p: PrecisionGroupResponse, channel: string | undefined): PrecisionChannelSummary {
  if (channel === undefined || channel === p.channel) return p;
  const other = p.per_channel.find((c) => c.channel === channel);
  if (!other) {
    const all = [p.channel, ...p.per_channel.map((c) => c.channel)];
    throw new UserError("unknown-channel", `Analysis ${p.analysis_id} has no channel "${channel}" (channels: ${all.join(", ")}).`, { status: 404, issues: [{ path: "query.channel", message: `not one of ${all.join(", ")}` }] });
  }
  return other;
}
