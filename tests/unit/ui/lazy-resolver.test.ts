import { zodResolver } from "@hookform/resolvers/zod";
import { describe, expect, it } from "vitest";
import { lazyResolver } from "@/components/ui/lazy-resolver";
import { signInSchema, type SignInInput } from "@/lib/validations/auth";

const options = { fields: {}, shouldUseNativeValidation: false } as const;

describe("lazyResolver (our choice: forms load zod on their first validation)", () => {
  it("gives the real resolver's verdicts, loading it once", async () => {
    let loads = 0;
    const resolver = lazyResolver<SignInInput>(async () => {
      loads += 1;
      return zodResolver(signInSchema);
    });
    const bad = await resolver({ email: "not an address", password: "" }, undefined, options);
    const real = await zodResolver(signInSchema)({ email: "not an address", password: "" }, undefined, options);
    expect(Object.keys(bad.errors).sort()).toEqual(["email", "password"]);
    expect(bad.errors.email?.message).toBe(real.errors.email?.message);
    const good = await resolver({ email: "pilot@example.com", password: "secret-enough" }, undefined, options);
    expect(good.errors).toEqual({});
    expect(loads).toBe(1);
  });

  it("tries the load again after one failed (offline on the first submit)", async () => {
    let loads = 0;
    const resolver = lazyResolver<SignInInput>(async () => {
      loads += 1;
      if (loads === 1) throw new Error("offline");
      return zodResolver(signInSchema);
    });
    await expect(resolver({ email: "", password: "" }, undefined, options)).rejects.toThrow("offline");
    expect(Object.keys((await resolver({ email: "", password: "" }, undefined, options)).errors)).toContain("email");
  });
});
