/**
 * A faulty network between simulated devices and the real route handlers (in process).
 * Each request meets one fault: delivered normally, lost on the way, delivered but its reply
 * lost, delivered twice, held back and delivered later (reordered after newer requests),
 * answered 500 by the server — before or after the handler ran — and, for pushes, the server
 * restarting mid-push (nothing committed) or committing it late, after later requests of
 * other devices (writers committing out of order; see sync-sim-server.ts).
 */

export type SimUser = { id: string; email: string; name: string; role: "member" | "admin" };

/** Calls a route handler as `user`; the test and the bench each provide one. */
export type Serve = (user: SimUser, url: string, init: RequestInit | undefined) => Promise<Response>;

/** Push faults only the server side can cause (sync-sim-server.ts). */
export type PushFaults = {
  crash(user: SimUser, init: RequestInit | undefined): Promise<void>;
  commitLate(user: SimUser, init: RequestInit | undefined, ms: number): Promise<void>;
};

export const FAULTS = ["ok", "lose-request", "lose-reply", "duplicate", "hold", "error-before", "error-after", "restart", "late-commit"] as const;
export type Fault = (typeof FAULTS)[number];

export class FaultyNetwork {
  /** Requests held back, delivered later by `deliverHeld` (replies go nowhere). */
  private held: { user: SimUser; url: string; init: RequestInit | undefined }[] = [];
  /** Pushes whose transactions commit later ("late-commit"). */
  private late: Promise<unknown>[] = [];
  readonly counts: Record<Fault, number> = {
    ok: 0, "lose-request": 0, "lose-reply": 0, duplicate: 0, hold: 0, "error-before": 0, "error-after": 0, restart: 0, "late-commit": 0,
  };
  faultRate: number;

  constructor(
    private readonly serve: Serve,
    private readonly random: () => number,
    faultRate = 0.3,
    private readonly pushFaults: PushFaults | null = null,
  ) {
    this.faultRate = faultRate;
  }

  private pick(url: string): Fault {
    if (this.random() >= this.faultRate) return "ok";
    const fault = FAULTS[1 + Math.floor(this.random() * (FAULTS.length - 1))]!;
    const serverSide = fault === "restart" || fault === "late-commit";
    return serverSide && !(this.pushFaults && url.startsWith("/api/sync/push")) ? "error-before" : fault;
  }

  /** A fetch for one device's user. */
  fetchFor(user: SimUser) {
    return async (url: string, init?: RequestInit): Promise<Response> => {
      const fault = this.pick(url);
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
        case "restart":
          await this.pushFaults!.crash(user, init);
          throw new TypeError("Failed to fetch (the server restarted mid-push)");
        case "late-commit": {
          const ms = 5 + Math.floor(this.random() * 40);
          // the device gives up waiting; the transaction commits after later requests ran (or fails, and is resent)
          this.late.push(this.pushFaults!.commitLate(user, init, ms).catch(() => undefined));
          throw new TypeError("Failed to fetch (timed out while the server was still committing)");
        }
      }
    };
  }

  /** Wait for every push committing late. */
  async lateCommits(): Promise<void> {
    await Promise.all(this.late.splice(0));
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
