import { describe, expect, it } from "vitest";
import { signInDelayMs } from "@/lib/auth/sign-in";

// Common practice (throttling of password guessing): the first few mistakes cost nothing,
// later ones are slowed down more and more, up to a cap.
describe("sign-in slow-down", () => {
  it("lets the first three failures through at once", () => {
    expect([0, 1, 2].map(signInDelayMs)).toEqual([0, 0, 0]);
  });
  it("doubles the wait after that and caps it at 8 s", () => {
    expect([3, 4, 5, 6, 7, 20].map(signInDelayMs)).toEqual([500, 1000, 2000, 4000, 8000, 8000]);
  });
});
