// Which address a request comes from: the socket, or the hop a trusted proxy appended.
import { describe, expect, it } from "vitest";
import { pickClientAddress } from "@/modules/platform/client-address";

describe("pickClientAddress", () => {
  it("with no trusted proxy ignores X-Forwarded-For entirely", () => {
    expect(pickClientAddress({ peer: "192.0.2.10", forwardedFor: "6.6.6.6", trustedHops: 0 })).toBe("192.0.2.10");
    expect(pickClientAddress({ peer: "::ffff:192.0.2.10", forwardedFor: null, trustedHops: 0 })).toBe("192.0.2.10");
  });

  it("with one proxy takes the last entry (the one the proxy appended), never the client's first", () => {
    expect(pickClientAddress({ peer: "10.0.0.2", forwardedFor: "6.6.6.6, 7.7.7.7, 203.0.113.9", trustedHops: 1 })).toBe("203.0.113.9");
  });

  it("with two proxies takes the entry the outer proxy appended", () => {
    expect(pickClientAddress({ peer: "10.0.0.2", forwardedFor: "6.6.6.6, 203.0.113.9, 10.0.0.1", trustedHops: 2 })).toBe("203.0.113.9");
  });

  it("a request that skipped the proxy counts as its socket or the leftmost trusted entry", () => {
    expect(pickClientAddress({ peer: "198.51.100.4", forwardedFor: null, trustedHops: 1 })).toBe("198.51.100.4");
    expect(pickClientAddress({ peer: "10.0.0.2", forwardedFor: "203.0.113.9", trustedHops: 3 })).toBe("203.0.113.9");
  });

  it("without a socket address every request is one address", () => {
    expect(pickClientAddress({ peer: null, forwardedFor: "6.6.6.6", trustedHops: 1 })).toBe("unknown");
  });
});
