import { describe, expect, it } from "vitest";
import { signInMessage } from "./messages";
import { humanWait } from "@/lib/human-wait";

describe("sign-in refusal messages", () => {
  it("state the wait the server asked for", () => {
    expect(signInMessage("rate_limited_30")).toBe("Too many failed sign-ins from here for this address. Try again in 30 seconds, or ask for a sign-in link.");
    expect(signInMessage("rate_limited_1")).toContain("Try again in 1 second,");
    expect(signInMessage("rate_limited_600")).toContain("Try again in 10 minutes");
  });

  it("say the credentials are wrong otherwise", () => {
    for (const c of ["bad_credentials", undefined, null, "", "rate_limited", "rate_limited_x"]) expect(signInMessage(c)).toBe("E-mail or password is wrong.");
  });

  it("round waits up for a person", () => {
    expect(humanWait(0.2)).toBe("1 second");
    expect(humanWait(89)).toBe("89 seconds");
    expect(humanWait(90)).toBe("2 minutes");
    expect(humanWait(3600)).toBe("60 minutes");
    expect(humanWait(5401)).toBe("2 hours");
  });
});
