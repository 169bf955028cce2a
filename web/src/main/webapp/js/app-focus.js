/*
 * Spanwright page: the input in focus. Shows it above the Inputs list, asks the engine for its
 * witness (flow or potentials) and has the drawing show it with a legend; the worst positive and
 * worst negative inputs are one key away. The parts are shared through self.SwPage (see
 * app-state.js).
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const P = self.SwPage;
  const state = P.state;
  const view = P.drawing;
  const $ = function (id) { return document.getElementById(id); };

  function focusInput(x) {
    let i = P.indexOfCode(P.codeOf(x));
    if (i < 0 && state.analysis && state.analysis.xs) i = P.addCandidate(x);   // beyond enumeration: list it now
    if (i < 0) { P.notify("Input " + x + " is not in the list.", "info"); return; }
    if (P.viewPosOf(i) < 0) { $("filter").value = "all"; P.buildView(); }
    setFocus(i);
  }

  function setFocus(i, keepQuiet) {
    const a = state.analysis;
    if (!a || i < 0 || i >= a.n) return;
    state.focus = i;
    const x = P.xOf(a.codes[i]);
    document.body.dataset.focus = x;
    const info = $("focus-info");
    const fl = a.flags[i];
    info.textContent = "";
    if (a.xs) {   // one of the engine's candidates beyond enumeration (app-structure.js)
      P.candidateFocusInfo(info, i);
      P.scrollToFocus();
      P.renderRows();
      requestDetail(x);
      return;
    }
    const line1 = document.createElement("div");
    line1.className = "focus-line";
    const xs = document.createElement("span"); xs.id = "focus-x"; xs.textContent = x;
    line1.appendChild(document.createTextNode("In focus: x = "));
    line1.appendChild(xs);
    const vars = state.scenario.variables.map(function (name, k) { return name + "=" + x.charAt(k); }).join(" ");
    line1.appendChild(document.createTextNode("  (" + vars + ")"));
    info.appendChild(line1);
    const line2 = document.createElement("div");
    line2.id = "focus-value";
    line2.dataset.value = String(a.values[i]);
    line2.textContent = ((fl & 1) ? "positive: s and t connected, effective resistance R = " : "negative: s and t apart, effective capacitance C = ") +
      F.num(a.values[i]) + ((fl & 2) ? "; f(x) = " + ((fl & 4) ? 1 : 0) : "") + (P.isBad(fl) ? " — a counterexample" : "");
    info.appendChild(line2);
    P.scrollToFocus();
    P.renderRows();
    requestDetail(x);
  }

  function clearFocus() {
    state.focus = -1;
    state.focusDetail = null;
    delete document.body.dataset.focus;
    $("focus-info").textContent = "No input in focus. Click a row, or press ↓, 1 (worst positive) or 0 (worst negative).";
    view.clearFocus();
    renderLegend(null);
    P.renderRows();
  }

  function requestDetail(x) {
    const serial = ++state.detailSerial;
    state.bridge.call("detail", P.text(), x).then(function (d) {
      if (serial !== state.detailSerial) return;
      if (!d.ok) { state.focusDetail = null; view.clearFocus(); $("focus-caption").textContent = "No witness for this input: " + ((d.error && d.error.message) || "unknown problem"); return; }
      state.focusDetail = d;
      const info = view.showFocus(d, state.display);
      renderLegend(info);
      document.body.dataset.focusDrawn = x;
      P.hooks.focus.forEach(function (h) { h(x); });
    });
  }

  function reapplyFocus() {
    if (state.focusDetail) renderLegend(view.showFocus(state.focusDetail, state.display));
  }

  function renderLegend(info) {
    const lg = $("legend");
    lg.textContent = "";
    const lines = document.createElement("div");
    lines.className = "legend-lines";
    if (!info) {
      lines.textContent = "◇ s (source)  □ t (sink)  · edge label: condition (a, !a, 1) and weight w if not 1" + view.labelNote();
      lg.appendChild(lines);
      return;
    }
    lines.textContent = "solid: present in G(x) · dashed: absent" + (info.positive && !info.useRamp ? " · width ∝ |current i|, arrow = direction of the unit current s→t" : "") +
      (!info.positive && view.labelLevel === "full" ? " · E = energy on an absent edge" : "") + view.labelNote();
    lg.appendChild(lines);
    if (info.useRamp && isFinite(info.pmin)) {
      const bar = document.createElement("div");
      bar.className = "legend-ramp";
      const lo = document.createElement("span"); lo.textContent = "φ " + F.num(info.pmin) + (info.positive ? "" : " (t side)");
      const grad = document.createElement("span"); grad.className = "ramp-bar"; grad.style.background = F.rampCss();
      const hi = document.createElement("span"); hi.textContent = F.num(info.pmax) + (info.positive ? "" : " (s side)");
      bar.appendChild(lo); bar.appendChild(grad); bar.appendChild(hi);
      lg.appendChild(bar);
    }
  }

  function worst(kind) {
    const a = state.analysis;
    if (!a) return;
    const side = a.worst ? { worst: a.worst[kind] } : kind === "pos" ? a.result.positive : a.result.negative;
    if (!side || !side.worst) { P.notify("There is no " + (kind === "pos" ? "positive" : "negative") + " input in the domain.", "info"); return; }
    focusInput(side.worst);
  }
  $("worst-pos").addEventListener("click", function () { worst("pos"); });
  $("worst-neg").addEventListener("click", function () { worst("neg"); });

  Object.assign(P, {
    focusInput: focusInput, setFocus: setFocus, clearFocus: clearFocus, reapplyFocus: reapplyFocus, worst: worst
  });
})();
