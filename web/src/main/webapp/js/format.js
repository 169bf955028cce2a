/* Small display helpers: number formatting, the potential colour ramp, downloads. No mathematics. */
(function () {
  "use strict";

  /** A number for people: up to 6 significant digits, ∞ for infinity, – for missing. */
  function num(v) {
    if (v === null || v === undefined || (typeof v === "number" && isNaN(v))) return "–";
    if (v === Infinity) return "∞";
    if (v === -Infinity) return "−∞";
    if (v === 0) return "0";
    const a = Math.abs(v);
    let s;
    if (a >= 1e6 || a < 1e-4) s = v.toExponential(4).replace(/\.?0+e/, "e");
    else s = String(Number(v.toPrecision(6)));
    return s.replace("-", "−");
  }

  /** Integers with thin grouping: 65536 -> "65,536". */
  function count(n) {
    return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  }

  /*
   * Colour ramp for potentials, 0 (t side) to 1 (s side): a blue-to-yellow ramp whose lightness
   * rises monotonically, so it reads the same for the common colour-vision deficiencies and in
   * grey scale. Stops chosen by us.
   */
  const RAMP = [[23, 37, 84], [52, 76, 120], [96, 109, 125], [145, 143, 117], [196, 178, 96], [247, 222, 76]];
  function ramp(t) {
    if (!(t >= 0)) t = 0;
    if (t > 1) t = 1;
    const x = t * (RAMP.length - 1);
    const i = Math.min(RAMP.length - 2, Math.floor(x));
    const f = x - i;
    const c = [0, 1, 2].map(function (k) { return Math.round(RAMP[i][k] + f * (RAMP[i + 1][k] - RAMP[i][k])); });
    return "rgb(" + c[0] + "," + c[1] + "," + c[2] + ")";
  }
  function rampText(t) { return t > 0.55 ? "#111" : "#fff"; }
  function rampCss() {
    return "linear-gradient(to right," + RAMP.map(function (c, i) {
      return "rgb(" + c.join(",") + ") " + Math.round(100 * i / (RAMP.length - 1)) + "%";
    }).join(",") + ")";
  }

  function download(name, blobOrUrl) {
    const a = document.createElement("a");
    a.download = name;
    a.href = typeof blobOrUrl === "string" ? blobOrUrl : URL.createObjectURL(blobOrUrl);
    document.body.appendChild(a);
    a.click();
    setTimeout(function () { a.remove(); if (typeof blobOrUrl !== "string") URL.revokeObjectURL(a.href); }, 1000);
  }

  /** A file name from a title: letters, digits, dashes. */
  function fileName(title, ext) {
    const base = String(title || "scenario").toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60);
    return (base || "scenario") + ext;
  }

  /** Line and column (1-based) of a character offset in text. */
  function lineCol(text, offset) {
    let line = 1, col = 1;
    for (let i = 0; i < offset && i < text.length; i++) {
      if (text.charCodeAt(i) === 10) { line++; col = 1; } else col++;
    }
    return "line " + line + ", column " + col;
  }

  /** A readable message for a JSON.parse failure, naming line and column where the browser tells. */
  function jsonProblem(text, err) {
    const m = /position (\d+)/.exec(err && err.message || "");
    const where = m ? " at " + lineCol(text, Number(m[1])) : "";
    const lc = /line (\d+) column (\d+)/.exec(err && err.message || "");
    return "it is not valid JSON" + (where || (lc ? " at line " + lc[1] + ", column " + lc[2] : ""));
  }

  self.SwFormat = { num: num, count: count, ramp: ramp, rampText: rampText, rampCss: rampCss,
    download: download, fileName: fileName, jsonProblem: jsonProblem };
})();
