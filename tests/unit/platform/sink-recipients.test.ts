import { describe, expect, it } from "vitest";
import { messagesAddressedTo } from "@/lib/email/sink-message";

// /dev/mail shows a user the messages delivered to their own address only: the whole address, compared
// with the SMTP envelope's recipients, never a part of it.

const message = (id: string, recipients: string[]) => ({ id, recipients });

describe("messagesAddressedTo", () => {
  const messages = [
    message("ann", ["ann@halvorsen-lab.example"]),
    message("longer", ["long.ann@halvorsen-lab.example"]),
    message("sub-domain", ["ann@halvorsen-lab.example.org"]),
    message("both", ["bo@halvorsen-lab.example", "ann@halvorsen-lab.example"]),
    message("nobody", []),
  ];

  it("keeps exactly the messages whose recipients include the address, newest first as given", () => {
    expect(messagesAddressedTo(messages, "ann@halvorsen-lab.example").map((m) => m.id)).toEqual(["ann", "both"]);
  });

  it("ignores the case and surrounding spaces of the signed-in address", () => {
    expect(messagesAddressedTo(messages, " Ann@Halvorsen-Lab.example ").map((m) => m.id)).toEqual(["ann", "both"]);
  });

  it("returns nothing for an address that is only part of a recipient, or empty", () => {
    expect(messagesAddressedTo(messages, "n@halvorsen-lab.example")).toEqual([]);
    expect(messagesAddressedTo(messages, "halvorsen-lab.example")).toEqual([]);
    expect(messagesAddressedTo(messages, "")).toEqual([]);
  });
});
