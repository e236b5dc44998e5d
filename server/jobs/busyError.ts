import { UserError } from "../userError.ts";

/** Too much work waiting: answered with 429 and a Retry-After header of `retryAfterS` seconds. */
export class BusyError extends UserError {
  readonly retryAfterS: number;

  constructor(message: string, retryAfterS: number) {
    super("busy", message, { status: 429 });
    this.retryAfterS = retryAfterS;
  }
}
