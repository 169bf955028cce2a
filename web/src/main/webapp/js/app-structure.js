/*
 * Spanwright page: analyses beyond enumeration. When the engine chooses its structural method
 * (too many inputs to list: a host graph with one variable per edge), the worker hands the
 * analysis to a task worker of its own (worker.js); this file shows the time it has been working,
 * then the engine's answer: W₊, W₋ and the bound, the reduction verdict, which method ran and why,
 * and in the Inputs panel the engine's candidates instead of every input — the worst path (W₊)
 * and the worst bond (W₋) as inputs, with how many paths or bonds the engine searched. Focusing a
 * candidate draws its witness like any input (the engine's detail works at any size). The parts
 * are shared through self.SwPage (see app-state.js). No mathematics here: every number and every
 * reason is the engine's.
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const P = self.SwPage;
  const state = P.state;
  const $ = function (id) { return document.getElementById(id); };

  const SUP = { "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹" };
  function twoTo(n) { return "2" + String(n).split("").map(function (c) { return SUP[c] || c; }).join(""); }
  /** A count the engine sent as decimal text (it may exceed a double's exact range), with separators. */
  function bigCount(t) { return String(t).replace(/\B(?=(\d{3})+(?!\d))/g, ","); }

  // ------------------------------------------------------------------ method line

  /** The Summary's line saying which method ran and why (the engine's words), for either method. */
  function showMethod(method, reason) {
    const el = $("method-line");
    document.body.dataset.method = method || "enumerate";
    el.dataset.method = method || "";
    el.textContent = reason ? "Method: " + reason + "." : "";
  }

  // ------------------------------------------------------------------ while the engine works

  let workTimer = 0;
  /** The progress row while the structural engine works: no count to show, so the time so far. */
  function structureWorking(id, info) {
    clearInterval(workTimer);
    const nvars = state.scenario.variables.length;
    $("progress-row").hidden = false;
    $("progress").removeAttribute("value");   // indeterminate
    $("status").textContent = "analysing by structure…";
    document.body.dataset.analysisMethod = "structure";
    const tick = function () {
      if (state.job !== id) { clearInterval(workTimer); return; }
      const s = (performance.now() - info.started) / 1000;
      const t = $("progress-text");
      t.textContent = "working… " + s.toFixed(1) + " s · structural engine, " + twoTo(nvars) + " inputs not enumerated";
      t.dataset.elapsed = s.toFixed(1);
    };
    tick();
    workTimer = setInterval(tick, 100);
  }

  // ------------------------------------------------------------------ the answer

  function setFigure(id, side) {
    const el = $(id);
    const has = side && side.worst && typeof side.value === "number";
    el.textContent = has ? F.num(side.value) : "–";
    el.dataset.value = has ? String(side.value) : "";
    el.dataset.exact = side && side.exact === false ? "false" : "true";
    el.title = !has ? "no inputs of this kind" : side.exact === false
      ? "a budget was reached: the value lies in the certified interval [" + side.value + ", " + side.upper + "]" : String(side.value);
    if (has && side.exact === false) el.textContent = "≥ " + F.num(side.value);
  }

  /** One candidate row from a side of the engine's answer: its worst input with its witness. */
  function candidate(side, kind) {
    const d = side.worst;
    const counted = side.extremeInputs !== null && side.extremeInputs !== undefined;
    const what = kind === "pos" ? (counted ? "worst path" : "worst positive input") : (counted ? "worst bond" : "worst negative input");
    let stands = "";
    if (counted) {
      stands = "the heaviest of " + bigCount(side.extremeInputs) + (kind === "pos" ? " simple s–t paths (the minimal positive inputs)"
        : " s–t bonds (the maximal negative inputs)");
    } else {
      stands = "found by " + String(side.how || "the structural engine");
    }
    return { x: d.x, kind: kind, label: what + (kind === "pos" ? " (W₊)" : " (W₋)"), stands: stands,
      value: typeof d.value === "number" ? d.value : NaN, connected: !!d.connected, f: d.f, exact: side.exact !== false };
  }

  /** The typed arrays the Inputs panel and the focus read, from the candidate rows. */
  function pack(a) {
    const n = a.rows.length;
    a.n = n;
    a.codes = new Int32Array(n);
    a.values = new Float64Array(n);
    a.flags = new Uint8Array(n);
    a.xs = [];
    a.rows.forEach(function (r, i) {
      a.codes[i] = i;
      a.values[i] = r.value;
      a.flags[i] = (r.connected ? 1 : 0) | (r.f === null || r.f === undefined ? 0 : 2) | (r.f === 1 || r.f === true ? 4 : 0);
      a.xs.push(r.x);
    });
  }

  function showStructure(result, m, scenarioText) {
    $("error-box").hidden = true;
    document.body.classList.remove("stale");
    const previousX = state.focus >= 0 && state.analysis ? P.xOf(state.analysis.codes[state.focus]) : null;
    const nvars = typeof result.variables === "number" ? result.variables : state.scenario.variables.length;
    const pos = result.maxResistance || {}, neg = result.maxCapacitance || {};
    const rows = [];
    if (pos.worst) rows.push(candidate(pos, "pos"));
    if (neg.worst) rows.push(candidate(neg, "neg"));
    const a = { result: result, nvars: nvars, text: scenarioText, structure: true, rows: rows, ms: m.ms,
      worst: { pos: pos.worst ? pos.worst.x : null, neg: neg.worst ? neg.worst.x : null } };
    pack(a);
    state.analysis = a;

    setFigure("sum-wplus", pos);
    setFigure("sum-wminus", neg);
    const bound = $("sum-bound");
    const b = typeof result.complexity === "number" ? result.complexity : null;
    bound.textContent = b === null ? "–" : (result.exact === false ? "≥ " : "") + F.num(b);
    bound.dataset.value = b === null ? "" : String(b);
    bound.title = b === null ? "no inputs of one kind" : result.exact === false
      ? "a budget was reached: the bound lies in [" + b + ", " + result.complexityUpper + "]" : String(b);

    const counts = $("counts");
    const sides = [];
    if (pos.worst) sides.push("W₊ " + (pos.exact === false ? "in [" + F.num(pos.value) + ", " + F.num(pos.upper) + "]" : "exact"));
    if (neg.worst) sides.push("W₋ " + (neg.exact === false ? "in [" + F.num(neg.value) + ", " + F.num(neg.upper) + "]" : "exact"));
    counts.textContent = twoTo(nvars) + " inputs in the domain, not enumerated" + (sides.length ? "; " + sides.join(", ") : "") +
      (result.exact === false ? " (a budget was reached: certified intervals)" : "") + ".";
    counts.dataset.domainVariables = String(nvars);

    showVerdict(result);
    $("worst-pos").disabled = !pos.worst;
    $("worst-neg").disabled = !neg.worst;

    const timing = $("timing");
    timing.textContent = "Structural analysis in " + F.num(m.ms / 1000) + " s by the " + (state.engine === "wasm" ? "WebAssembly-GC" : "JavaScript") +
      " engine (in a worker of its own; no input enumerated)." + (m.fallback ? " Note: " + m.fallback + "." : "");
    timing.dataset.ms = String(m.ms);
    timing.dataset.rate = "";
    timing.dataset.engine = state.engine;
    timing.dataset.method = "structure";
    P.analysisShown(previousX, null);
  }

  /** The reduction verdict in the engine's terms (by construction, holds, fails, not checked). */
  function showVerdict(result) {
    const red = result.reduction || {};
    const verdict = $("verdict");
    verdict.textContent = "";
    verdict.dataset.correct = red.correct === true ? "yes" : red.correct === false ? "no" : "unchecked";
    if (red.status === "by construction") {
      verdict.textContent = "✓ The graph decides f by construction: f is s–t connectivity of this graph.";
    } else if (red.correct === true) {
      verdict.textContent = "✓ The graph decides f on every input (" + String(red.how || "checked without enumerating") + ").";
    } else if (red.correct === false) {
      verdict.appendChild(document.createTextNode("✗ The graph does not decide f: " + bigCount(red.counterexamples) + " counterexample" +
        (String(red.counterexamples) === "1" ? "" : "s") + " (" + String(red.how || "") + "). First: "));
      (red.first || []).slice(0, 8).forEach(function (x) {
        const b = document.createElement("button");
        b.className = "linkish";
        b.textContent = x.length > 24 ? x.slice(0, 24) + "…" : x;
        b.title = x;
        b.addEventListener("click", function () { P.focusInput(x); });
        verdict.appendChild(b);
      });
      if (result.complexityNote) verdict.appendChild(document.createTextNode(" — " + result.complexityNote + "."));
    } else {
      verdict.textContent = "The reduction is not checked: " + String(red.how || "no function given") + ".";
    }
  }

  // ------------------------------------------------------------------ the candidates list

  function buildCandidates() {
    const a = state.analysis;
    const filter = $("filter").value, sort = $("sort").value;
    const idx = [];
    for (let i = 0; i < a.n; i++) {
      const fl = a.flags[i];
      if (filter === "pos" && !(fl & 1)) continue;
      if (filter === "neg" && (fl & 1)) continue;
      if (filter === "bad" && !P.isBad(fl)) continue;
      idx.push(i);
    }
    if (sort !== "input") {
      const sign = sort === "desc" ? -1 : 1;
      idx.sort(function (p, q) {
        const x = a.values[p], y = a.values[q];
        if (x === y || (isNaN(x) && isNaN(y))) return p - q;
        if (isNaN(x)) return 1;
        if (isNaN(y)) return -1;
        return sign * (x - y);
      });
    }
    state.view = Uint32Array.from(idx);
    $("list-count").textContent = F.count(idx.length) + " of " + F.count(a.n) + " candidates shown: the inputs the structural engine found, " +
      "not every input (" + twoTo(a.nvars) + " of them)";
    renderCandidates();
  }

  function renderCandidates() {
    const box = $("candidates");
    const a = state.analysis;
    box.textContent = "";
    if (!a || !a.xs || !state.view) return;
    const res = a.result;
    const wp = res.maxResistance && res.maxResistance.value, wm = res.maxCapacitance && res.maxCapacitance.value;
    Array.prototype.forEach.call(state.view, function (i) {
      const r = a.rows[i];
      const fl = a.flags[i];
      const row = document.createElement("div");
      row.className = "cand" + ((fl & 1) ? " pos" : "") + (P.isBad(fl) ? " bad" : "") + (i === state.focus ? " focused" : "");
      row.setAttribute("role", "option");
      row.setAttribute("aria-selected", i === state.focus ? "true" : "false");
      row.dataset.index = String(i);
      row.dataset.kind = r.kind;
      row.dataset.x = r.x;
      row.dataset.value = String(r.value);
      const head = document.createElement("div");
      head.className = "cand-head";
      const label = document.createElement("span");
      label.className = "cand-label";
      label.textContent = r.label;
      const val = document.createElement("span");
      val.className = "cand-value";
      val.textContent = isNaN(r.value) ? "…" : ((fl & 1) ? "R = " : "C = ") + F.num(r.value) + (P.isBad(fl) ? "  ✗" : "");
      head.appendChild(label);
      head.appendChild(val);
      row.appendChild(head);
      const stands = document.createElement("div");
      stands.className = "cand-stands";
      stands.textContent = r.stands + ((fl & 2) ? " · f(x) = " + ((fl & 4) ? 1 : 0) : "");
      row.appendChild(stands);
      const x = document.createElement("div");
      x.className = "cand-x";
      x.textContent = r.x;
      x.title = r.x;
      row.appendChild(x);
      const bar = document.createElement("span");
      bar.className = "bar";
      const max = (fl & 1) ? wp : wm;
      bar.style.width = (max > 0 && isFinite(r.value) ? Math.max(0, Math.min(1, r.value / max)) * 100 : 0).toFixed(1) + "%";
      row.appendChild(bar);
      row.addEventListener("click", function () { P.setFocus(i); $("candidates").focus(); });
      box.appendChild(row);
    });
  }

  /** An input that is not a candidate yet (a counterexample the verdict names): listed now, its
   *  value filled in from the engine's detail. Returns its row index, or −1 if it is not an input. */
  function addCandidate(x) {
    const a = state.analysis;
    if (!a || !a.xs || typeof x !== "string" || x.length !== a.nvars || !/^[01]*$/.test(x)) return -1;
    const red = a.result.reduction || {};
    const bad = (red.first || []).indexOf(x) >= 0;
    a.rows.push({ x: x, kind: "other", label: bad ? "counterexample" : "input", stands: bad ? "the graph and f disagree here" : "an input you chose",
      value: NaN, connected: false, f: null, exact: true });
    pack(a);
    const i = a.n - 1;
    state.bridge.call("detail", a.text, x).then(function (d) {
      if (state.analysis !== a || !d.ok) return;
      const r = a.rows[i];
      r.value = typeof d.value === "number" ? d.value : NaN;
      r.connected = !!d.connected;
      r.f = d.f;
      pack(a);
      P.buildView();
      if (state.focus === i) P.setFocus(i, true);
    });
    P.buildView();
    return i;
  }

  /** The focus line for a candidate: what it is, its input (long: wrapped, small), the variables on
   *  its smaller side, and its R or C. */
  function candidateFocusInfo(info, i) {
    const a = state.analysis;
    const r = a.rows[i];
    const fl = a.flags[i];
    const line1 = document.createElement("div");
    line1.className = "focus-line";
    line1.appendChild(document.createTextNode("In focus: " + r.label + ", x = "));
    const xs = document.createElement("span");
    xs.id = "focus-x";
    xs.className = "focus-x-long";
    xs.textContent = r.x;
    line1.appendChild(xs);
    info.appendChild(line1);
    const names = state.scenario.variables;
    const ones = [], zeros = [];
    for (let k = 0; k < r.x.length && k < names.length; k++) (r.x.charAt(k) === "1" ? ones : zeros).push(names[k]);
    // a path is named by its edges (= 1), a bond by its cut edges (= 0); otherwise the smaller side
    const few = r.kind === "pos" ? ones : r.kind === "neg" ? zeros : ones.length <= zeros.length ? ones : zeros;
    const which = few === ones ? "1" : "0";
    const shown = few.slice(0, 8).join(", ") + (few.length > 8 ? ", … (" + (few.length - 8) + " more)" : "");
    const line = document.createElement("div");
    line.className = "focus-vars";
    line.textContent = few.length ? few.length + " variable" + (few.length === 1 ? "" : "s") + " = " + which + " (the other " +
      (names.length - few.length) + " = " + (which === "1" ? "0" : "1") + "): " + shown : "every variable = " + (which === "1" ? "0" : "1");
    info.appendChild(line);
    const line2 = document.createElement("div");
    line2.id = "focus-value";
    line2.dataset.value = String(a.values[i]);
    line2.textContent = isNaN(a.values[i]) ? "asking the engine…" : ((fl & 1) ? "positive: s and t connected, effective resistance R = "
      : "negative: s and t apart, effective capacitance C = ") + F.num(a.values[i]) + ((fl & 2) ? "; f(x) = " + ((fl & 4) ? 1 : 0) : "") +
      (P.isBad(fl) ? " — a counterexample" : "");
    info.appendChild(line2);
  }

  $("candidates").addEventListener("keydown", function (ev) {
    if (ev.key === "Enter" && state.view && state.view.length && state.focus < 0) P.setFocus(state.view[0]);
  });

  Object.assign(P, {
    showMethod: showMethod, structureWorking: structureWorking, showStructure: showStructure,
    buildCandidates: buildCandidates, renderCandidates: renderCandidates, addCandidate: addCandidate,
    candidateFocusInfo: candidateFocusInfo
  });
})();
