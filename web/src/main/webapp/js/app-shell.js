/*
 * Spanwright page, last of the app-*.js scripts: the shell around the panels. Presentation mode,
 * the keys, the result sheets (tabs), starting the engine, self.SwApp for the panels in the other
 * page scripts, the read-only window for tests, and the start of the page. The parts are shared
 * through self.SwPage (see app-state.js).
 */
(function () {
  "use strict";
  const P = self.SwPage;
  const state = P.state;
  const hooks = P.hooks;
  const view = P.drawing;
  const $ = function (id) { return document.getElementById(id); };

  const ENGINE_KEY = "spanwright.engine";

  // ------------------------------------------------------------------ presentation and keys

  function setPresenting(on) {
    document.body.dataset.mode = on ? "present" : "edit";
    view.setScale(on ? 1.5 : 1);
    $("histogram").hidden = on;
    setTimeout(function () { view.cy.resize(); view.fit(); P.reapplyFocus(); view.placeLabels(); hooks.mode.forEach(function (h) { h(on); }); }, 50);
  }
  $("present").addEventListener("click", function () { setPresenting(true); });

  function typing(ev) {
    const t = ev.target;
    return t && (t.tagName === "INPUT" || t.tagName === "TEXTAREA" || t.tagName === "SELECT" || t.isContentEditable);
  }

  document.addEventListener("keydown", function (ev) {
    const key = ev.key;
    if ((ev.ctrlKey || ev.metaKey) && (key === "z" || key === "Z")) {
      if (typing(ev) || document.querySelector("dialog[open]")) return;
      ev.preventDefault();
      if (ev.shiftKey) P.redo(); else P.undo();
      return;
    }
    if ((ev.ctrlKey || ev.metaKey) && (key === "y" || key === "Y") && !typing(ev)) { ev.preventDefault(); P.redo(); return; }
    if (typing(ev) || ev.ctrlKey || ev.metaKey || ev.altKey) return;
    if (document.querySelector("dialog[open]")) return;   // a dialog has the keyboard
    const presenting = document.body.dataset.mode === "present";
    if (ev.shiftKey && (key === "ArrowDown" || key === "ArrowUp" || key === "PageDown" || key === "PageUp")) {
      ev.preventDefault();
      scrollSheet(key === "ArrowDown" ? 1 : key === "ArrowUp" ? -1 : key === "PageDown" ? 8 : -8);
      return;
    }
    switch (key) {
      case "ArrowDown": case "ArrowRight": ev.preventDefault(); P.step(1); break;
      case "ArrowUp": case "ArrowLeft": ev.preventDefault(); P.step(-1); break;
      case "PageDown": ev.preventDefault(); P.step(20); break;
      case "PageUp": ev.preventDefault(); P.step(-20); break;
      case "1": P.worst("pos"); break;
      case "0": P.worst("neg"); break;
      case "v": case "V":
        state.display = state.display === "flow" ? "potential" : "flow";
        document.body.dataset.display = state.display;
        P.reapplyFocus();
        break;
      case "m": case "M": setPresenting(!presenting); break;
      case "s": case "S": showSheet("summary"); break;
      case "w": case "W": showSheet("weights"); break;
      case "b": case "B": showSheet("bounds"); break;
      case "r": case "R": showSheet("run"); break;
      case "g": case "G": showSheet("sweep"); break;
      case "f": case "F": view.wholeGraph(); break;
      case "d": case "D": if (!presenting) P.toggleSides(); break;
      case "n": case "N": if (!presenting && window.SwBuilder) { ev.preventDefault(); window.SwBuilder.open(); } break;
      case "l": case "L": if (!presenting) { ev.preventDefault(); P.showOpenBox(); } break;
      case "Escape": if (presenting) setPresenting(false); $("keys-help").hidden = true; break;
      case "?": $("keys-help").hidden = !$("keys-help").hidden; break;
      case "Delete": case "Backspace": if (!presenting && state.selection) { ev.preventDefault(); P.deleteElement(state.selection); } break;
      default: break;
    }
  });

  /** Scrolls the visible result sheet by steps of an eighth of its height (8 steps: one height),
   *  so an overflowing sheet can be read from the keyboard while the arrows step through inputs. */
  function scrollSheet(steps) {
    const sheet = document.querySelector("#sheet-" + currentSheet + " .sheet-scroll");
    if (!sheet) return;
    sheet.scrollBy({ top: steps * Math.max(40, Math.round(sheet.clientHeight / 8)), behavior: "instant" });
    document.body.dataset.sheetScroll = String(Math.round(sheet.scrollTop));
  }

  // ------------------------------------------------------------------ engine start

  function engineLabel(e) { return e === "wasm" ? "WebAssembly-GC" : "JavaScript"; }

  function preferredEngine() {
    const q = /[?&]engine=(js|wasm|auto)\b/.exec(location.search);
    if (q) return q[1];
    try { return localStorage.getItem(ENGINE_KEY) || "auto"; } catch (e) { return "auto"; }
  }

  function startEngine(preferred, then) {
    if (state.bridge) state.bridge.terminate();
    state.job = 0;
    $("engine-badge").textContent = "engine: starting…";
    const bridge = new self.SpanwrightEngineBridge(preferred, function (m) {
      state.engine = m.engine;
      const badge = $("engine-badge");
      badge.dataset.engine = m.engine;
      badge.textContent = "engine: " + (m.engine === "wasm" ? "wasm-GC" : "JS");
      badge.setAttribute("aria-label", "engine: " + engineLabel(m.engine));
      badge.title = (m.note ? m.note + " " : "") + "Started in " + Math.round(m.loadMs) + " ms.";
      if (m.note && preferred === "wasm") P.notify(m.note, "info");
      document.body.dataset.engineFunctions = (m.functions || []).join(" ");
      hooks.engine.forEach(function (h) { h(m); });
      if (then) then();
    }, function (message) {
      P.notify(message, "error");
      $("engine-badge").textContent = "engine: failed";
    });
    state.bridge = bridge;
  }

  $("engine-choice").addEventListener("change", function () {
    const v = $("engine-choice").value;
    try { localStorage.setItem(ENGINE_KEY, v); } catch (e) { /* ignore */ }
    startEngine(v, function () { P.runAnalysis(); });
  });

  function boot() {
    const pref = preferredEngine();
    $("engine-choice").value = pref;
    const init = P.initialScenario();
    P.startScenario(init.scenario, init.from !== "autosave" || init.pristine);
    P.clearFocus();
    document.body.dataset.loadedFrom = init.from;
    startEngine(pref, function () {
      P.openFragment(true).then(function (opened) { if (!opened) P.runAnalysis(); });
    });
  }

  // ------------------------------------------------------------------ result sheets (tabs)

  let currentSheet = "summary";
  function showSheet(name) {
    if (!$("sheet-" + name)) return;
    currentSheet = name;
    document.querySelectorAll(".sheet-tabs [role=tab]").forEach(function (t) {
      const on = t.dataset.sheet === name;
      t.setAttribute("aria-selected", on ? "true" : "false");
      t.tabIndex = on ? 0 : -1;
    });
    document.querySelectorAll("#summary-panel .sheet").forEach(function (p) { p.hidden = p.id !== "sheet-" + name; });
    document.body.dataset.sheet = name;
    hooks.sheet.forEach(function (h) { h(name); });
  }
  document.querySelectorAll(".sheet-tabs [role=tab]").forEach(function (t) {
    t.addEventListener("click", function () { showSheet(t.dataset.sheet); });
    t.addEventListener("keydown", function (ev) {
      if (ev.key !== "ArrowLeft" && ev.key !== "ArrowRight") return;
      ev.preventDefault();
      ev.stopPropagation();
      const tabs = Array.prototype.slice.call(document.querySelectorAll(".sheet-tabs [role=tab]"));
      const k = (tabs.indexOf(t) + (ev.key === "ArrowRight" ? 1 : tabs.length - 1)) % tabs.length;
      tabs[k].focus();
      showSheet(tabs[k].dataset.sheet);
    });
  });

  // ------------------------------------------------------------------ what other scripts see

  /**
   * What the panels in the other page scripts may use: the scenario text, edits (undoable), the
   * engine bridge and task workers, messages. They hold no scenario state of their own.
   */
  self.SwApp = {
    text: P.text,
    scenario: function () { return state.scenario; },
    commitScenario: function (obj) { return P.commit(function () { return obj; }); },
    loadText: P.loadText,
    notify: P.notify,
    bridge: function () { return state.bridge; },
    newTask: function () { return new self.SpanwrightEngineTask(state.engine || preferredEngine()); },
    has: function (fn) { return !!(state.bridge && state.bridge.ready && state.bridge.has(fn)); },
    engineReady: function () { return !!(state.bridge && state.bridge.ready); },
    analysis: function () { return state.analysis; },
    focusX: function () { return state.focus >= 0 && state.analysis ? P.xOf(state.analysis.codes[state.focus]) : null; },
    focusDetail: function () { return state.focusDetail; },
    gallery: function () { return P.gallery.slice(); },
    sheet: function () { return currentSheet; },
    showSheet: showSheet,
    presenting: function () { return document.body.dataset.mode === "present"; },
    on: function (what, fn) { hooks[what].push(fn); }
  };

  // A read-only window for tests and for the curious: the current scenario text and analysis.
  window.SpanwrightView = view;
  window.Spanwright = {
    scenarioText: function () { return P.text(); },
    engine: function () { return state.engine; },
    focus: function () { return state.focus >= 0 && state.analysis ? P.xOf(state.analysis.codes[state.focus]) : null; },
    summary: function () { return state.analysis ? JSON.stringify(state.analysis.result) : null; }
  };

  boot();
})();
