/**
 * A faulty network between simulated devices and the real route handlers (in process).
 * Each request meets one fault: delivered normally, lost on the way, delivered but its reply
 * lost, delivered twice, held back and delivered later (reordered after newer requests),
 * or answered 500 by the server — before or after the handler ran.
 */

export type SimUser = { id: string; email: string; name: string; role: "member" | "admin" };

/** Calls a route handler as `user`; the test and the bench each provide one. */
export type Serve = (user: SimUser, url: string, init: RequestInit | undefined) => Promise<Response>;

export const FAULTS = ["ok", "lose-request", "lose-reply", "duplicate", "hold", "error-before", "error-after"] as const;
export type Fault = (typeof FAULTS)[number];

export class FaultyNetwork {
  /** Requests held back, delivered later by `deliverHeld` (replies go nowhere). */
  private held: { user: SimUser; url: string; init: RequestInit | undefined }[] = [];
  readonly counts: Record<Fault, number> = { ok: 0, "lose-request": 0, "lose-reply": 0, duplicate: 0, hold: 0, "error-before": 0, "error-after": 0 };
  faultRate: number;

  constructor(
    private readonly serve: Serve,
    private readonly random: () => number,
    faultRate = 0.3,
  ) {
    this.faultRate = faultRate;
  }

  private pick(): Fault {
    if (this.random() >= this.faultRate) return "ok";
    return FAULTS[1 + Math.floor(this.random() * (FAULTS.length - 1))]!;
  }

  /** A fetch for one device's user. */
  fetchFor(user: SimUser) {
    return async (url: string, init?: RequestInit): Promise<Response> => {
      const fault = this.pick();
      this.counts[fault] += 1;
      const send = () => this.serve(user, url, init);
      switch (fault) {
        case "ok":
          return send();
        case "lose-request":
          throw new TypeError("Failed to fetch (request lost)");
        case "lose-reply":
          await send();
          throw new TypeError("Failed to fetch (reply lost)");
        case "duplicate":
          await send();
          return send();
        case "hold":
          this.held.push({ user, url, init });
          throw new TypeError("Failed to fetch (timed out)");
        case "error-before":
          return Response.json({ error: { code: "internal", message: "injected" } }, { status: 500 });
        case "error-after":
          await send();
          return Response.json({ error: { code: "internal", message: "injected" } }, { status: 500 });
      }
    };
  }

  /** Deliver up to `n` held requests, oldest or newest first at random (reordering). */
  async deliverHeld(n = Infinity): Promise<void> {
    for (let i = 0; i < n && this.held.length > 0; i++) {
      const index = this.random() < 0.5 ? 0 : this.held.length - 1;
      const [req] = this.held.splice(index, 1);
      await this.serve(req!.user, req!.url, req!.init);
    }
  }
}
