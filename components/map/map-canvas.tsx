"use client";

import { useEffect, useRef, useState } from "react";
import type { MapReport } from "@/lib/suggest/map";

const UNLABELLED = "#9aa0a8";

function rgba(hex: string, alpha: number) {
  const h = hex.replace("#", "");
  const n = parseInt(h.length === 3 ? h.replace(/./g, (c) => c + c) : h, 16);
  return `rgba(${(n >> 16) & 255}, ${(n >> 8) & 255}, ${n & 255}, ${alpha})`;
}

/** Regions as tinted tiles (stronger where the vote is more one-sided) with ink seams where the region changes; points on top. */
export function MapCanvas({ report, k, colours, label }: { report: MapReport; k: number; colours: string[]; label: string }) {
  const wrap = useRef<HTMLDivElement>(null);
  const canvas = useRef<HTMLCanvasElement>(null);
  const [width, setWidth] = useState(800);

  useEffect(() => {
    const el = wrap.current;
    if (!el) return;
    const ro = new ResizeObserver(([e]) => setWidth(Math.max(320, Math.floor(e.contentRect.width))));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  useEffect(() => {
    const c = canvas.current;
    if (!c) return;
    const height = Math.round(width * 0.7);
    const dpr = window.devicePixelRatio || 1;
    c.width = width * dpr;
    c.height = height * dpr;
    c.style.width = `${width}px`;
    c.style.height = `${height}px`;
    const g = c.getContext("2d");
    if (!g) return;
    g.setTransform(dpr, 0, 0, dpr, 0, 0);
    const pad = { l: 40, r: 12, t: 12, b: 34 };
    const { size, xMin, xMax, yMin, yMax } = report.grid;
    const sx = (width - pad.l - pad.r) / (xMax - xMin || 1);
    const sy = (height - pad.t - pad.b) / (yMax - yMin || 1);
    const px = (x: number) => pad.l + (x - xMin) * sx;
    const py = (y: number) => height - pad.b - (y - yMin) * sy;
    g.fillStyle = "#fffdf8";
    g.fillRect(0, 0, width, height);
    const region = report.regions[String(k)];
    const cw = (width - pad.l - pad.r) / size;
    const ch = (height - pad.t - pad.b) / size;
    if (region) {
      for (let gy = 0; gy < size; gy += 1) {
        for (let gx = 0; gx < size; gx += 1) {
          const ci = region.classIndex[gy * size + gx];
          if (ci < 0) continue;
          // Whole-pixel edges: overlapping translucent tiles would draw seams.
          const x0 = Math.round(pad.l + gx * cw);
          const x1 = Math.round(pad.l + (gx + 1) * cw);
          const y0 = Math.round(height - pad.b - (gy + 1) * ch);
          const y1 = Math.round(height - pad.b - gy * ch);
          g.fillStyle = rgba(colours[ci] ?? UNLABELLED, 0.1 + 0.32 * (region.topShare[gy * size + gx] / 100));
          g.fillRect(x0, y0, x1 - x0, y1 - y0);
        }
      }
      g.strokeStyle = "rgba(29, 36, 51, 0.35)";
      g.lineWidth = 1;
      g.beginPath();
      for (let gy = 0; gy < size; gy += 1) {
        for (let gx = 0; gx < size; gx += 1) {
          const ci = region.classIndex[gy * size + gx];
          const x0 = pad.l + (gx + 1) * cw;
          const y0 = height - pad.b - (gy + 1) * ch;
          if (gx + 1 < size && region.classIndex[gy * size + gx + 1] !== ci) {
            g.moveTo(x0, y0);
            g.lineTo(x0, y0 + ch);
          }
          if (gy + 1 < size && region.classIndex[(gy + 1) * size + gx] !== ci) {
            g.moveTo(x0 - cw, y0);
            g.lineTo(x0, y0);
          }
        }
      }
      g.stroke();
    }
    for (const [, x, y, ci] of report.points) {
      if (ci >= 0) continue;
      g.fillStyle = UNLABELLED;
      g.fillRect(px(x) - 1, py(y) - 1, 2, 2);
    }
    g.lineWidth = 0.8;
    g.strokeStyle = "#fffdf8";
    for (const [, x, y, ci] of report.points) {
      if (ci < 0) continue;
      g.fillStyle = colours[ci] ?? UNLABELLED;
      g.beginPath();
      g.arc(px(x), py(y), 2.6, 0, Math.PI * 2);
      g.fill();
      g.stroke();
    }
    g.strokeStyle = "#b9b1a2";
    g.strokeRect(pad.l, pad.t, width - pad.l - pad.r, height - pad.t - pad.b);
    g.fillStyle = "#4a5263";
    g.font = "12px system-ui, sans-serif";
    g.textAlign = "center";
    g.fillText(`1st principal axis (${(100 * report.explainedVariance[0]).toFixed(0)}% of variance)`, pad.l + (width - pad.l - pad.r) / 2, height - 10);
    g.save();
    g.translate(14, pad.t + (height - pad.t - pad.b) / 2);
    g.rotate(-Math.PI / 2);
    g.fillText(`2nd axis (${(100 * report.explainedVariance[1]).toFixed(0)}%)`, 0, 0);
    g.restore();
  }, [report, k, colours, width]);

  return (
    <div ref={wrap} className="w-full">
      <canvas ref={canvas} role="img" aria-label={label} className="block rounded-md border border-line" />
    </div>
  );
}
