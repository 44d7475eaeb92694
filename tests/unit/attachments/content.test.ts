// Attachments judged by content: magic bytes for PDF, PNG, JPEG and FITS, valid UTF-8
// without NULs for text; at most 20 MB; names cleaned so they can never act as paths.
import { describe, expect, it } from "vitest";
import { checkAttachment, checkSize } from "@/lib/attachments/check";
import { MAX_ATTACHMENT_BYTES, sniffContent } from "@/lib/attachments/content";
import { sanitizeFileName } from "@/lib/attachments/names";
import { describeUploadError } from "@/lib/attachments/upload-errors";

const bytes = (...parts: (string | number[])[]) =>
  new Uint8Array(parts.flatMap((p) => (typeof p === "string" ? [...new TextEncoder().encode(p)] : p)));

const PNG = bytes([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a], [0, 0, 0, 13], "IHDR");
const JPEG = bytes([0xff, 0xd8, 0xff, 0xe0], "JFIF");
const PDF = bytes("%PDF-1.7\n%âãÏÓ\n");
const FITS = bytes("SIMPLE  =                    T / conforms to FITS standard".padEnd(80));

describe("sniffContent", () => {
  it("recognises each accepted kind by its first bytes", () => {
    expect(sniffContent(PNG)).toBe("png");
    expect(sniffContent(JPEG)).toBe("jpeg");
    expect(sniffContent(PDF)).toBe("pdf");
    expect(sniffContent(FITS)).toBe("fits");
    expect(sniffContent(bytes("utc,ra,dec\n2026-12-01T00:00:00Z,05:35:17,−05:23:28\n"))).toBe("text");
  });

  it("refuses binary content, NUL bytes and broken UTF-8", () => {
    expect(sniffContent(bytes([0x50, 0x4b, 0x03, 0x04], "zip"))).toBeNull();
    expect(sniffContent(bytes("text", [0], "more"))).toBeNull();
    expect(sniffContent(bytes([0xc3, 0x28]))).toBeNull();
    expect(sniffContent(bytes("SIMPLE =  T"))).toBe("text"); // one space short: not FITS, though it is text
    expect(sniffContent(new Uint8Array())).toBeNull();
  });
});

describe("checkAttachment", () => {
  it("accepts each kind under a matching name, with its content type", () => {
    expect(checkAttachment("chart.png", PNG)).toEqual({ ok: true, fileName: "chart.png", contentType: "image/png" });
    expect(checkAttachment("field.JPG", JPEG)).toEqual({ ok: true, fileName: "field.JPG", contentType: "image/jpeg" });
    expect(checkAttachment("frame.fits", FITS)).toEqual({ ok: true, fileName: "frame.fits", contentType: "application/fits" });
    expect(checkAttachment("case.pdf", PDF)).toEqual({ ok: true, fileName: "case.pdf", contentType: "application/pdf" });
    expect(checkAttachment("ephemeris.csv", bytes("utc,ra,dec\n"))).toEqual({ ok: true, fileName: "ephemeris.csv", contentType: "text/csv" });
  });

  it("refuses a file whose content is not what its name says", () => {
    expect(checkAttachment("chart.png", bytes("just some text"))).toEqual({
      ok: false,
      fileName: "chart.png",
      reason: "“chart.png” is named like a PNG image but its content is plain text or CSV.",
    });
    expect(checkAttachment("notes.txt", PDF)).toMatchObject({ ok: false, reason: "“notes.txt” is named like plain text or CSV but its content is a PDF document." });
    expect(checkAttachment("archive.zip", bytes([0x50, 0x4b, 0x03, 0x04]))).toMatchObject({ ok: false, reason: expect.stringMatching(/is not a PDF, PNG, JPEG, FITS, CSV or plain-text file/) });
  });

  it("refuses files over 20 MB and empty files before reading them", () => {
    expect(checkSize("deep.fits", MAX_ATTACHMENT_BYTES)).toBeNull();
    expect(checkSize("deep.fits", MAX_ATTACHMENT_BYTES + 1)).toEqual({ ok: false, fileName: "deep.fits", reason: "“deep.fits” is 20.0 MB; attachments may be at most 20 MB." });
    expect(checkSize("huge.fits", 64 * 1024 * 1024)?.ok).toBe(false);
    expect(checkAttachment("empty.txt", new Uint8Array())).toMatchObject({ ok: false, reason: "“empty.txt” is empty." });
  });

  it("neutralises a name that tries to leave the storage folder", () => {
    expect(checkAttachment("../../etc/passwd", bytes("root:x:0:0:root:/root:/bin/sh\n"))).toEqual({ ok: true, fileName: "passwd.txt", contentType: "text/plain" });
    expect(checkAttachment("..\\..\\windows\\chart.png", PNG)).toMatchObject({ ok: true, fileName: "chart.png" });
  });
});

describe("sanitizeFileName", () => {
  it("keeps only the last segment, without control characters, leading dots or shell-awkward marks", () => {
    expect(sanitizeFileName("../../etc/passwd")).toBe("passwd");
    expect(sanitizeFileName("/absolute/path/finding chart.png")).toBe("finding chart.png");
    expect(sanitizeFileName("..")).toBe("file");
    expect(sanitizeFileName(".hidden")).toBe("hidden");
    expect(sanitizeFileName('a"b\r\nX-Injected: 1.txt')).toBe("a_bX-Injected_ 1.txt");
    expect(sanitizeFileName("  ")).toBe("file");
    const long = sanitizeFileName(`${"x".repeat(300)}.fits`);
    expect(long).toHaveLength(120);
    expect(long.endsWith(".fits")).toBe(true);
  });
});

describe("describeUploadError", () => {
  it("keeps our route's own refusals and explains the rest plainly", () => {
    expect(describeUploadError({ code: "BAD_REQUEST", message: "“big.fits” is 21.0 MB; attachments may be at most 20 MB." })).toBe("“big.fits” is 21.0 MB; attachments may be at most 20 MB.");
    expect(describeUploadError({ code: "FORBIDDEN", message: "This request has been filed: its attachments can no longer change." })).toMatch(/has been filed/);
    expect(describeUploadError({ _tag: "FetchError", error: new TypeError("fetch failed") })).toMatch(/^The upload service is not answering/);
    expect(describeUploadError({ code: "INTERNAL_CLIENT_ERROR", message: "Something went wrong. Please report this to UploadThing.", cause: { _tag: "FetchError" } })).toMatch(
      /^The upload service is not answering.*Everything you typed is kept/,
    );
    expect(describeUploadError({ code: "UPLOAD_FAILED", message: "XHR failed 502 Bad Gateway" })).toMatch(/^The upload service is not answering/);
    expect(describeUploadError(new Error("odd"))).toBe("The upload failed (odd). Everything you typed is kept: try again.");
  });
});
