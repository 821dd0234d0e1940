import { request as httpRequest } from "node:http";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { largeBandFile, largeFileMapping } from "@/tests/unit/datasets/large-file";
import { type Refusal, type UploadTeam, createUploadTeam, storedRows, upload } from "./helpers";

// Issue 11, items 8 and 9 through the upload route: band indices the int4 column cannot hold (2³¹ − 1 =
// 2 147 483 647 is its largest value, PostgreSQL 15 manual §8.1.1) are refused, not wrapped, and a 20 MB
// header line is refused at once; nothing is stored. While a large file is parsed the server keeps
// answering other requests (the parse pauses for the event loop between chunks).

const mapping = {
  name: "Halvorsen band column check",
  source: "calculation",
  format: "long",
  k: { kind: "cartesian", columns: ["kx"] },
  band: { column: "band" },
  energy: { column: "E", unit: "eV" },
} as const;

let team: UploadTeam;
beforeAll(async () => {
  team = await createUploadTeam("Halvorsen Limits Lab");
});

async function expectRefused(bytes: Uint8Array | string, body: unknown = mapping): Promise<Refusal> {
  const before = await storedRows(team);
  const response = await upload(team, { name: "limits.csv", bytes }, body);
  expect(response.status).toBe(422);
  expect(await storedRows(team)).toEqual(before);
  return response.body as Refusal;
}

describe("band indices the database cannot hold", () => {
  it.each([
    ["2³¹ − 1", "2147483647"],
    ["2³¹", "2147483648"],
    ["2³² + 1", "4294967297"],
  ])("refuses band %s with row and column and stores nothing", async (_, band) => {
    const refusal = await expectRefused(`kx,band,E\n0,1,-1\n0.1,${band},-1\n0.2,1,-0.9\n`);
    expect(refusal.error.issues).toEqual([
      {
        row: 3,
        column: 2,
        columnName: "band",
        message: `band index “${band}” is above the limit of 100 000 (bands count from 1; is this the band column?)`,
      },
    ]);
  });
});

describe("a header line of 20 MB", () => {
  it("is refused with the line limit and stores nothing", async () => {
    const refusal = await expectRefused(`kx,band,E${",x".repeat(10_000_000)}\n0,1,-1\n`);
    expect(refusal.error.issues).toEqual([
      { row: 1, column: null, columnName: null, message: "this line is longer than the limit of 1 MiB (1 048 576 bytes) for one line" },
    ]);
  }, 60_000);
});

/** Sends a multipart upload over node:http, reporting when the whole body has been handed to the socket. */
function uploadWithProgress(bytes: Uint8Array, onBodySent: () => void): Promise<{ status: number; body: Refusal }> {
  const form = new FormData();
  form.append("file", new Blob([bytes as BlobPart], { type: "text/csv" }), "large-with-a-bad-last-row.csv");
  form.append("mapping", JSON.stringify(largeFileMapping));
  const encoded = new Response(form);
  return encoded.arrayBuffer().then(
    (body) =>
      new Promise((resolve, reject) => {
        const url = new URL(`/api/workspaces/${team.slug}/datasets`, inject("baseUrl"));
        const request = httpRequest(
          url,
          {
            method: "POST",
            headers: {
              authorization: `Bearer ${team.editorKey}`,
              "content-type": encoded.headers.get("content-type") ?? "",
              "content-length": body.byteLength,
            },
          },
          (response) => {
            let text = "";
            response.setEncoding("utf8");
            response.on("data", (chunk: string) => (text += chunk));
            response.on("end", () => resolve({ status: response.statusCode ?? 0, body: JSON.parse(text) as Refusal }));
          },
        );
        request.on("error", reject);
        request.on("finish", onBodySent);
        request.end(Buffer.from(body));
      }),
  );
}

describe("while a large upload is parsed", () => {
  it("GET /api/health still answers, before the upload does", async () => {
    const health = async () => (await fetch(new URL("/api/health", inject("baseUrl")))).status;
    expect(await health()).toBe(200); // the worker probe is now shared and cached for 5 s
    // 500 000 points whose last row is bad: the whole file is parsed, then refused, nothing stored.
    const good = largeBandFile({ points: 500_000 });
    const badRow = new TextEncoder().encode("B,0.1,0.1,1,abc,0.01\n");
    const bytes = new Uint8Array(good.byteLength + badRow.byteLength);
    bytes.set(good);
    bytes.set(badRow, good.byteLength);
    const lastRow = new TextDecoder().decode(bytes).split("\n").length - 1;

    const before = await storedRows(team);
    let bodySentAt = Infinity;
    let uploadAnsweredAt = Infinity;
    const answered: { sentAt: number; answeredAt: number; status: number }[] = [];
    const uploading = uploadWithProgress(bytes, () => (bodySentAt = performance.now())).then((result) => {
      uploadAnsweredAt = performance.now();
      return result;
    });
    // One health request after another until the upload answers.
    while (uploadAnsweredAt === Infinity) {
      const sentAt = performance.now();
      const status = await health();
      answered.push({ sentAt, answeredAt: performance.now(), status });
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
    const refused = await uploading;
    expect(refused.status).toBe(422);
    expect(refused.body.error.issues).toEqual([{ row: lastRow, column: 5, columnName: "E_eV", message: "“abc” is not a number" }]);
    expect(await storedRows(team)).toEqual(before);

    // Requests sent well after the body had arrived (the server then reads and parses it: about a second
    // for 500 000 points) were answered while the upload was still being worked on.
    const duringParse = answered.filter((h) => h.sentAt > bodySentAt + 250 && h.answeredAt < uploadAnsweredAt);
    expect(duringParse.length).toBeGreaterThan(0);
    expect(duringParse.every((h) => h.status === 200)).toBe(true);
  }, 120_000);
});
