/*
 * Small canvas charts for the result sheets: a line chart with markers, and eigenphases on a
 * circle. They draw numbers the engine computed; they compute nothing but pixel positions.
 * Series are told apart by marker shape and line dash as well as by colour.
 */
(function () {
  "use strict";
  const F = self.SwFormat;

  const INK = "#111";
  const GRID = "#d9d4ca";
  /** Colour-blind-safe series colours (dark blue, orange-brown, grey-black), each with its own
   *  marker and dash so that colour never carries the meaning alone. */
  const SERIES = [
    { color: "#1f5fa8", marker: "circle", dash: [] },
    { color: "#b8620a", marker: "square", dash: [6, 4] },
    { color: "#444444", marker: "triangle", dash: [2, 3] }
  ];

  /** Resizes the canvas backing store to its shown size (sharp lines at any zoom). */
  function prepare(cv) {
    const dpr = self.devicePixelRatio || 1;
    const w = Math.max(50, Math.round(cv.clientWidth || cv.width));
    const h = Math.max(40, Math.round(cv.clientHeight || cv.height));
    if (cv.width !== Math.round(w * dpr) || cv.height !== Math.round(h * dpr)) {
      cv.width = Math.round(w * dpr);
      cv.height = Math.round(h * dpr);
    }
    const ctx = cv.getContext("2d");
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    ctx.clearRect(0, 0, w, h);
    return { ctx: ctx, w: w, h: h };
  }

  function marker(ctx, kind, x, y, r) {
    ctx.beginPath();
    if (kind === "square") ctx.rect(x - r, y - r, 2 * r, 2 * r);
    else if (kind === "triangle") { ctx.moveTo(x, y - r * 1.2); ctx.lineTo(x + r * 1.1, y + r * 0.9); ctx.lineTo(x - r * 1.1, y + r * 0.9); ctx.closePath(); }
    else ctx.arc(x, y, r, 0, 2 * Math.PI);
    ctx.fill();
  }

  /**
   * Line chart. series: [{label, points: [[x, y], …]}]; opts: {xLabel, yLabel, xInteger,
   * yMin, yMax, font}. Axis ends are labelled with the data's own extremes.
   */
  function line(cv, series, opts) {
    opts = opts || {};
    const p = prepare(cv);
    const ctx = p.ctx;
    const fs = opts.font || 11;
    ctx.font = fs + "px system-ui, sans-serif";
    let x0 = Infinity, x1 = -Infinity, y0 = Infinity, y1 = -Infinity;
    series.forEach(function (s) {
      s.points.forEach(function (q) {
        if (!isFinite(q[0]) || !isFinite(q[1])) return;
        x0 = Math.min(x0, q[0]); x1 = Math.max(x1, q[0]); y0 = Math.min(y0, q[1]); y1 = Math.max(y1, q[1]);
      });
    });
    if (opts.yMin !== undefined) y0 = Math.min(y0, opts.yMin);
    if (opts.yMax !== undefined) y1 = Math.max(y1, opts.yMax);
    if (!isFinite(x0)) { ctx.fillStyle = INK; ctx.fillText("no data", 8, p.h / 2); return; }
    if (x1 === x0) { x0 -= 1; x1 += 1; }
    if (y1 === y0) { const d = Math.abs(y0) * 0.05 || 1; y0 -= d; y1 += d; }
    const yl = [F.num(y1), F.num(y0)];
    const left = 8 + Math.max(ctx.measureText(yl[0]).width, ctx.measureText(yl[1]).width);
    const legendH = series.length > 1 ? fs + 8 : 0;
    const top = 6 + legendH, right = p.w - 8, bottom = p.h - fs - 10;
    const X = function (v) { return left + (v - x0) / (x1 - x0) * (right - left); };
    const Y = function (v) { return bottom - (v - y0) / (y1 - y0) * (bottom - top); };
    ctx.strokeStyle = GRID; ctx.lineWidth = 1; ctx.setLineDash([]);
    ctx.strokeRect(left + 0.5, top + 0.5, right - left, bottom - top);
    ctx.fillStyle = INK;
    ctx.fillText(yl[0], 4, top + fs * 0.8);
    ctx.fillText(yl[1], 4, bottom);
    const xa = opts.xInteger ? String(Math.round(x0)) : F.num(x0);
    const xb = opts.xInteger ? String(Math.round(x1)) : F.num(x1);
    ctx.fillText(xa, left, p.h - 4);
    ctx.fillText(xb, right - ctx.measureText(xb).width, p.h - 4);
    if (opts.xLabel) { const t = opts.xLabel; ctx.fillText(t, (left + right - ctx.measureText(t).width) / 2, p.h - 4); }
    const lw = opts.lineWidth || 1.8;
    const mr = opts.markerRadius || 3;
    series.forEach(function (s, i) {
      const st = SERIES[i % SERIES.length];
      ctx.strokeStyle = st.color; ctx.fillStyle = st.color; ctx.lineWidth = lw; ctx.setLineDash(st.dash);
      ctx.beginPath();
      let started = false;
      s.points.forEach(function (q) {
        if (!isFinite(q[0]) || !isFinite(q[1])) return;
        if (!started) { ctx.moveTo(X(q[0]), Y(q[1])); started = true; } else ctx.lineTo(X(q[0]), Y(q[1]));
      });
      ctx.stroke();
      ctx.setLineDash([]);
      const every = Math.max(1, Math.ceil(s.points.length / 40));
      s.points.forEach(function (q, j) { if (j % every === 0 || j === s.points.length - 1) marker(ctx, st.marker, X(q[0]), Y(q[1]), mr); });
    });
    if (series.length > 1) {
      let lx = left;
      series.forEach(function (s, i) {
        const st = SERIES[i % SERIES.length];
        ctx.strokeStyle = st.color; ctx.fillStyle = st.color; ctx.lineWidth = lw; ctx.setLineDash(st.dash);
        ctx.beginPath(); ctx.moveTo(lx, 4 + fs / 2); ctx.lineTo(lx + 22, 4 + fs / 2); ctx.stroke(); ctx.setLineDash([]);
        marker(ctx, st.marker, lx + 11, 4 + fs / 2, mr);
        ctx.fillStyle = INK;
        ctx.fillText(s.label, lx + 27, 4 + fs * 0.85);
        lx += 36 + ctx.measureText(s.label).width;
      });
    }
  }

  /**
   * Eigenphases on the unit circle: a spoke at angle θ for each phase, its length ∝ the weight of
   * |0⟩ on that eigenvector (the largest weight reaches the rim band). Phase 0 points right.
   * opts: {highlight: radians — phases with |θ| ≤ highlight drawn solid and marked}.
   */
  function phaseCircle(cv, phases, weights, opts) {
    opts = opts || {};
    const p = prepare(cv);
    const ctx = p.ctx;
    const fs = opts.font || 11;
    ctx.font = fs + "px system-ui, sans-serif";
    const cx = p.w / 2, cy = p.h / 2;
    const R = Math.min(p.w, p.h) / 2 - fs - 8;
    // Dashed rim: where a spoke of the largest weight ends; light axis through phase 0 and π.
    ctx.strokeStyle = GRID; ctx.lineWidth = 1; ctx.setLineDash([4, 4]);
    ctx.beginPath(); ctx.arc(cx, cy, R, 0, 2 * Math.PI); ctx.stroke();
    ctx.setLineDash([]);
    ctx.beginPath(); ctx.moveTo(cx - R, cy); ctx.lineTo(cx + R, cy); ctx.stroke();
    ctx.strokeStyle = INK;
    ctx.beginPath(); ctx.arc(cx, cy, R * 0.35, 0, 2 * Math.PI); ctx.stroke();
    ctx.fillStyle = INK;
    ctx.fillText("0", cx + R + 4, cy + fs / 3);
    ctx.fillText("π", cx - R - 4 - ctx.measureText("π").width, cy + fs / 3);
    ctx.fillText("π/2", cx - ctx.measureText("π/2").width / 2, cy - R - 3);
    let wmax = 0;
    weights.forEach(function (w) { if (w > wmax) wmax = w; });
    const inner = R * 0.35;
    phases.forEach(function (th, i) {
      const w = weights[i] || 0;
      const len = wmax > 0 ? (R - inner) * w / wmax : 0;
      const near = opts.highlight !== undefined && Math.abs(th) <= opts.highlight;
      const c = Math.cos(th), s = -Math.sin(th);
      ctx.strokeStyle = near ? SERIES[0].color : SERIES[1].color;
      ctx.lineWidth = opts.lineWidth || 2.5;
      ctx.setLineDash([]);
      ctx.beginPath();
      ctx.moveTo(cx + inner * c, cy + inner * s);
      ctx.lineTo(cx + (inner + Math.max(len, 1.5)) * c, cy + (inner + Math.max(len, 1.5)) * s);
      ctx.stroke();
      ctx.fillStyle = ctx.strokeStyle;
      marker(ctx, near ? "circle" : "square", cx + inner * c, cy + inner * s, 2);
    });
  }

  self.SwCharts = { line: line, phaseCircle: phaseCircle, SERIES: SERIES };
})();
