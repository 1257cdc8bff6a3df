/**
 * A drawing as a picture: the SVG given a fixed pixel size, drawn to a PNG on a canvas (in the
 * page, no network), copied to the clipboard where the browser allows it, or handed to the
 * workbook port as base64 to place on the add-in's sheet.
 */

/** Size of a drawing in CSS pixels at scale 1 (its viewBox), and the markup with that size fixed. */
export interface SizedSvg {
  readonly markup: string;
  readonly width: number;
  readonly height: number;
}

/**
 * Give a drawing (root `<svg ... viewBox="0 0 W H" width="100%">`, as the renderers make) a
 * fixed size of W x scale by H x scale pixels, so an image decoder draws it at that size.
 * @param svg - the renderer's markup
 * @param scale - pixels per drawing unit
 * @throws Error when the markup has no root svg element with a viewBox
 */
export function sizedSvg(svg: string, scale: number): SizedSvg {
  const open = /^<svg\b[^>]*>/.exec(svg);
  const box = open ? /\sviewBox="\s*[-\d.]+[\s,]+[-\d.]+[\s,]+([\d.]+)[\s,]+([\d.]+)\s*"/.exec(open[0]) : null;
  if (!open || !box) throw new Error("The drawing has no viewBox.");
  const width = Math.round(Number(box[1]) * scale);
  const height = Math.round(Number(box[2]) * scale);
  const tag = open[0].replace(/\s(width|height)="[^"]*"/g, "").replace(/^<svg\b/, `<svg width="${width}" height="${height}"`);
  return { markup: tag + svg.slice(open[0].length), width, height };
}

/** Decode an SVG into an image element (from a blob: URL, allowed by the pane's img-src). */
async function imageOf(markup: string): Promise<HTMLImageElement> {
  const url = URL.createObjectURL(new Blob([markup], { type: "image/svg+xml" }));
  try {
    const img = new Image();
    img.decoding = "sync";
    img.src = url;
    await img.decode();
    return img;
  } finally {
    URL.revokeObjectURL(url);
  }
}

/**
 * Draw a drawing to a PNG.
 * @param svg - the renderer's markup
 * @param scale - pixels per drawing unit (2 gives 640 px for a 320-unit drawing)
 */
export async function pngOf(svg: string, scale = 2): Promise<{ blob: Blob; width: number; height: number }> {
  const sized = sizedSvg(svg, scale);
  const img = await imageOf(sized.markup);
  const canvas = document.createElement("canvas");
  canvas.width = sized.width;
  canvas.height = sized.height;
  const g = canvas.getContext("2d");
  if (!g) throw new Error("This browser cannot draw pictures (no canvas).");
  g.fillStyle = "#ffffff";
  g.fillRect(0, 0, sized.width, sized.height);
  g.drawImage(img, 0, 0, sized.width, sized.height);
  const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, "image/png"));
  if (!blob) throw new Error("The picture could not be made.");
  return { blob, width: sized.width, height: sized.height };
}

/** A blob's bytes as base64 (no "data:" prefix). */
export async function base64Of(blob: Blob): Promise<string> {
  const bytes = new Uint8Array(await blob.arrayBuffer());
  let text = "";
  for (let i = 0; i < bytes.length; i += 0x8000) text += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(text);
}

/** How a drawing was copied. */
export type CopyOutcome = "picture" | "svgText";

/**
 * Copy a drawing: as a PNG picture where the browser lets the page write images to the
 * clipboard, otherwise as its SVG text (which drawing programs and browsers open).
 * @param svg - the renderer's markup
 * @throws Error when the clipboard refuses both
 */
export async function copyDrawing(svg: string): Promise<CopyOutcome> {
  const clipboard = typeof navigator !== "undefined" ? navigator.clipboard : undefined;
  if (!clipboard) throw new Error("The clipboard is not available here.");
  if (typeof ClipboardItem !== "undefined" && typeof clipboard.write === "function") {
    try {
      const png = pngOf(svg).then((p) => p.blob);
      await clipboard.write([new ClipboardItem({ "image/png": png })]);
      return "picture";
    } catch {
      // Pictures refused (permissions, host): fall back to the SVG text below.
    }
  }
  await clipboard.writeText(sizedSvg(svg, 1).markup);
  return "svgText";
}

/**
 * Stack drawings (each a renderer's root svg with a viewBox) into one SVG, top to bottom, on
 * the widest one's width: for copying or inserting a member's diagrams as one picture.
 * @param svgs - renderer markup, in order
 */
export function stackSvgs(svgs: readonly string[]): string {
  const parts = svgs.map((s) => {
    const sized = sizedSvg(s, 1);
    return { ...sized, inner: s.replace(/^<svg\b[^>]*>/, "").replace(/<\/svg>\s*$/, ""), open: /^<svg\b[^>]*>/.exec(s)![0] };
  });
  const width = Math.max(0, ...parts.map((p) => p.width));
  let y = 0;
  let body = "";
  for (const p of parts) {
    const attrs = p.open.replace(/^<svg\b/, "").replace(/>$/, "").replace(/\s(width|height|x|y|xmlns)="[^"]*"/g, "");
    body += `<svg x="0" y="${y}" width="${p.width}" height="${p.height}"${attrs}>${p.inner}</svg>`;
    y += p.height;
  }
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${y}" width="100%">${body}</svg>`;
}
