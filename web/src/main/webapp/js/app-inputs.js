/*
 * Spanwright page: the Inputs list. Filters and sorts the rows of the engine's analysis and draws
 * only the rows in sight (so 2^20 inputs scroll smoothly); moving through the list moves the
 * focus. Also the conversions between input strings x, their codes and row indices. The parts are
 * shared through self.SwPage (see app-state.js).
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const P = self.SwPage;
  const state = P.state;
  const $ = function (id) { return document.getElementById(id); };

  const ROW_HEIGHT = 26;

  // ------------------------------------------------------------------ inputs and rows

  function indexOfCode(code) {
    const a = state.analysis;
    if (!a) return -1;
    // Full-cube domains are listed in input order, so index = code; check before searching.
    if (code < a.n && a.codes[code] === code) return code;
    for (let i = 0; i < a.n; i++) if (a.codes[i] === code) return i;
    return -1;
  }
  /* A row's code is its input read as a binary number; beyond enumeration (the engine's
   * candidates, app-structure.js) it is the candidate's number in a.xs, the input strings. */
  function codeOf(x) {
    const a = state.analysis;
    if (a && a.xs) return a.xs.indexOf(x);
    return parseInt(x, 2);
  }
  function xOf(code) {
    if (state.analysis && state.analysis.xs) return state.analysis.xs[code] || "";
    const n = state.analysis ? state.analysis.nvars : state.scenario.variables.length;
    if (n === 0) return "";
    let s = (code >>> 0).toString(2);
    while (s.length < n) s = "0" + s;
    return s;
  }

  // ------------------------------------------------------------------ inputs list

  function isBad(fl) { return (fl & 2) !== 0 && (((fl & 4) !== 0) !== ((fl & 1) !== 0)); }

  function buildView() {
    const a = state.analysis;
    if (!a) return;
    document.body.dataset.inputsList = a.xs ? "candidates" : "inputs";
    if (a.xs) { P.buildCandidates(); return; }   // app-structure.js
    const filter = $("filter").value;
    const sort = $("sort").value;
    const idx = [];
    for (let i = 0; i < a.n; i++) {
      const fl = a.flags[i];
      if (filter === "pos" && !(fl & 1)) continue;
      if (filter === "neg" && (fl & 1)) continue;
      if (filter === "bad" && !isBad(fl)) continue;
      idx.push(i);
    }
    let v = Uint32Array.from(idx);
    if (sort !== "input") {
      const vals = a.values;
      const sign = sort === "desc" ? -1 : 1;
      v.sort(function (p, q) {
        const x = vals[p], y = vals[q];
        if (x === y || (isNaN(x) && isNaN(y))) return p - q;
        if (isNaN(x)) return 1;
        if (isNaN(y)) return -1;
        return sign * (x - y);
      });
    }
    state.view = v;
    $("list-spacer").style.height = (v.length * ROW_HEIGHT) + "px";
    $("list-count").textContent = F.count(v.length) + " of " + F.count(a.n) + " inputs shown" + (a.n > 4096 ? " (rows are drawn as you scroll)" : "");
    renderRows();
  }

  const rowPool = [];
  function renderRows() {
    const list = $("list");
    const a = state.analysis;
    const v = state.view;
    if (!a || !v) return;
    if (a.xs) { P.renderCandidates(); return; }
    const first = Math.max(0, Math.floor(list.scrollTop / ROW_HEIGHT) - 5);
    const last = Math.min(v.length, first + Math.ceil(list.clientHeight / ROW_HEIGHT) + 10);
    const res = a.result;
    const wp = res.positive && res.positive.maxResistance, wm = res.negative && res.negative.maxCapacitance;
    let used = 0;
    for (let k = first; k < last; k++) {
      const i = v[k];
      let row = rowPool[used];
      if (!row) {
        row = document.createElement("div");
        row.className = "row";
        row.setAttribute("role", "option");
        ["x", "f", "conn", "val"].forEach(function (c) { const s = document.createElement("span"); s.className = "c-" + c; row.appendChild(s); });
        const bar = document.createElement("span"); bar.className = "bar"; row.appendChild(bar);
        row.addEventListener("click", function () { P.setFocus(Number(row.dataset.index)); $("list").focus(); });
        rowPool.push(row);
        list.appendChild(row);
      }
      used++;
      const fl = a.flags[i];
      const val = a.values[i];
      row.style.top = (k * ROW_HEIGHT) + "px";
      row.hidden = false;
      row.dataset.index = String(i);
      row.dataset.x = xOf(a.codes[i]);
      row.classList.toggle("pos", (fl & 1) !== 0);
      row.classList.toggle("bad", isBad(fl));
      row.classList.toggle("focused", i === state.focus);
      row.setAttribute("aria-selected", i === state.focus ? "true" : "false");
      row.children[0].textContent = row.dataset.x;
      row.children[1].textContent = (fl & 2) ? ((fl & 4) ? "1" : "0") : "–";
      row.children[2].textContent = (fl & 1) ? "yes" : "no";
      row.children[3].textContent = ((fl & 1) ? "R " : "C ") + F.num(val) + (isBad(fl) ? "  ✗" : "");
      const max = (fl & 1) ? wp : wm;
      const frac = max > 0 && isFinite(val) ? Math.max(0, Math.min(1, val / max)) : 0;
      row.children[4].style.width = (frac * 100).toFixed(1) + "%";
    }
    for (let j = used; j < rowPool.length; j++) rowPool[j].hidden = true;
  }
  $("list").addEventListener("scroll", function () { requestAnimationFrame(renderRows); });
  $("filter").addEventListener("change", function () { buildView(); scrollToFocus(); });
  $("sort").addEventListener("change", function () { buildView(); scrollToFocus(); });

  function viewPosOf(i) {
    const v = state.view;
    if (!v) return -1;
    for (let k = 0; k < v.length; k++) if (v[k] === i) return k;
    return -1;
  }
  function scrollToFocus() {
    const k = viewPosOf(state.focus);
    if (k < 0) return;
    const list = $("list");
    const top = k * ROW_HEIGHT;
    if (top < list.scrollTop || top + ROW_HEIGHT > list.scrollTop + list.clientHeight) list.scrollTop = Math.max(0, top - list.clientHeight / 2);
    renderRows();
  }

  function step(delta) {
    const v = state.view;
    if (!v || !v.length) return;
    let k = viewPosOf(state.focus);
    k = k < 0 ? (delta > 0 ? 0 : v.length - 1) : Math.max(0, Math.min(v.length - 1, k + delta));
    P.setFocus(v[k]);
  }

  Object.assign(P, {
    indexOfCode: indexOfCode, codeOf: codeOf, xOf: xOf, isBad: isBad,
    buildView: buildView, renderRows: renderRows, viewPosOf: viewPosOf, scrollToFocus: scrollToFocus, step: step
  });
})();
