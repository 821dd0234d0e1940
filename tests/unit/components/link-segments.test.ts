import { describe, expect, it } from "vitest";
import { linkSegments } from "@/components/format";

describe("linkSegments", () => {
  it("splits text around http(s) addresses and leaves trailing punctuation as text", () => {
    expect(linkSegments("Open http://127.0.0.1:3000/invitations/abc. Then accept.")).toEqual([
      { kind: "text", text: "Open " },
      { kind: "link", href: "http://127.0.0.1:3000/invitations/abc" },
      { kind: "text", text: ". Then accept." },
    ]);
  });

  it("keeps query strings and handles several links", () => {
    expect(linkSegments("a https://x.example/r?token=t1&b=2 b (http://y.example)")).toEqual([
      { kind: "text", text: "a " },
      { kind: "link", href: "https://x.example/r?token=t1&b=2" },
      { kind: "text", text: " b (" },
      { kind: "link", href: "http://y.example" },
      { kind: "text", text: ")" },
    ]);
  });

  it("does not treat other schemes as links", () => {
    expect(linkSegments("javascript:alert(1) ftp://x")).toEqual([{ kind: "text", text: "javascript:alert(1) ftp://x" }]);
  });
});
