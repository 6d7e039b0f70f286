// The Slackwater web page: a query editor, the results of each statement, a plot, downloads and
// the catalog. Plain browser JavaScript, no libraries: the server is often offline and serves
// these files itself. Everything the page shows comes from the HTTP API under /api/.
'use strict';

(function () {
  const QUERY_URL = '/api/query';
  const MAX_ROWS_SHOWN = 500;
  // The most of an answer the page reads (a cell export can be gigabytes; the downloads take it
  // whole). ?read-limit-mb=N in the page's address changes it.
  const READ_LIMIT_BYTES = readLimitMb() * 1024 * 1024;
  const TEXT_TYPE = 'text/plain; charset=utf-8';
  const FORMATS = {
    csv: { param: 'csv', accept: 'text/csv', file: 'slackwater-result.csv' },
    // .arrows is the registered file extension of the Arrow IPC stream format.
    arrow: { param: 'arrow', accept: 'application/vnd.apache.arrow.stream', file: 'slackwater-result.arrows' },
    png: { param: 'png', accept: 'image/png', file: 'slackwater-plot.png' },
  };

  const $ = (id) => document.getElementById(id);
  const editor = $('editor');
  const runButton = $('run');
  const runStatus = $('run-status');
  const errorBox = $('error');
  const resultsBox = $('results');
  const cautionsBox = $('cautions');
  const plot = $('plot');
  const plotBody = $('plot-body');
  const plotCaption = $('plot-caption');
  const downloadStatus = $('download-status');
  const examplesSelect = $('examples');

  /** What the results area shows now: the query text that produced it, and its plot if any. */
  const shown = { text: null, plotBlob: null, plotUrl: null };
  let runCounter = 0;
  let inFlight = null;

  // ---------- small DOM helpers ----------

  function el(tag, attrs, ...children) {
    const e = document.createElement(tag);
    for (const [k, v] of Object.entries(attrs || {})) {
      if (v === null || v === undefined || v === false) continue;
      if (k === 'class') e.className = v;
      else if (k === 'text') e.textContent = v;
      else if (k.startsWith('data-')) e.setAttribute(k, v);
      else if (k in e && typeof v !== 'string') e[k] = v;
      else e.setAttribute(k, v);
    }
    for (const c of children) {
      if (c === null || c === undefined || c === false) continue;
      e.append(c instanceof Node ? c : document.createTextNode(String(c)));
    }
    return e;
  }

  function clear(node) {
    while (node.firstChild) node.removeChild(node.firstChild);
  }

  function definitionList(entries) {
    const dl = el('dl', { class: 'facts' });
    for (const [k, v] of entries) {
      if (v === null || v === undefined || v === '') continue;
      dl.append(el('dt', { text: k }), el('dd', { text: String(v) }));
    }
    return dl;
  }

  function readLimitMb() {
    const asked = Number(new URLSearchParams(window.location.search).get('read-limit-mb'));
    return Number.isFinite(asked) && asked > 0 ? asked : 32;
  }

  // ---------- talking to the server ----------

  /** The answer's text, or null once it grows past READ_LIMIT_BYTES (the rest is not fetched). */
  async function readCapped(res, controller) {
    const reader = res.body.getReader();
    const parts = [];
    let size = 0;
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      size += value.byteLength;
      if (size > READ_LIMIT_BYTES) {
        controller.abort();
        return null;
      }
      parts.push(value);
    }
    return new TextDecoder('utf-8').decode(await new Blob(parts).arrayBuffer());
  }

  async function postQuery(text, format, extra, signal) {
    let url = QUERY_URL + '?format=' + encodeURIComponent(format.param);
    for (const [k, v] of Object.entries(extra || {})) url += '&' + k + '=' + encodeURIComponent(v);
    return fetch(url, {
      method: 'POST',
      headers: { 'Content-Type': TEXT_TYPE, Accept: format.accept },
      body: text,
      signal,
    });
  }

  /** An error answer as an RFC 9457 problem; answers that are not problem documents are wrapped. */
  async function readProblem(res) {
    const type = res.headers.get('Content-Type') || '';
    if (type.includes('json')) {
      try {
        const p = await res.json();
        if (p && typeof p === 'object') return Object.assign({ status: res.status }, p);
      } catch (e) {
        // fall through to the generic description
      }
    }
    return { status: res.status, title: 'The server answered ' + res.status + ' ' + res.statusText,
             detail: 'the answer was not a problem document' };
  }

  function unreachable(e) {
    return { title: 'The server cannot be reached', detail: String(e && e.message ? e.message : e) +
             '; check that the Slackwater server is running and reload the page' };
  }

  // ---------- running a query ----------

  async function run() {
    const text = editor.value;
    if (!text.trim()) {
      showProblem({ title: 'Nothing to run', detail: 'type a query, or choose an example and press "Use example"' }, text);
      return;
    }
    if (inFlight) inFlight.abort();
    const controller = new AbortController();
    inFlight = controller;
    const id = ++runCounter;
    const started = performance.now();
    // The button stays enabled (a disabled button drops keyboard focus); running again replaces this run.
    resultsBox.setAttribute('aria-busy', 'true');
    runStatus.textContent = 'Running…';
    let res;
    try {
      res = await postQuery(text, { param: 'json', accept: 'application/json' }, null, controller.signal);
    } catch (e) {
      if (id !== runCounter) return;
      finishRun();
      showProblem(unreachable(e), text);
      return;
    }
    if (id !== runCounter) return;
    if (!res.ok) {
      const problem = await readProblem(res);
      if (id !== runCounter) return;
      finishRun();
      showProblem(problem, text);
      return;
    }
    let answer;
    try {
      const body = await readCapped(res, controller);
      if (body === null) {
        if (id !== runCounter) return;
        finishRun();
        showTooLarge(text);
        return;
      }
      answer = JSON.parse(body);
    } catch (e) {
      if (id !== runCounter) return;
      finishRun();
      showProblem({ title: 'The answer could not be read', detail: 'the server sent results that are not JSON: ' + e.message }, text);
      return;
    }
    if (id !== runCounter) return;
    finishRun();
    const results = Array.isArray(answer.results) ? answer.results : [];
    const ms = performance.now() - started;
    const took = ms < 1000 ? Math.max(1, Math.round(ms)) + ' ms' : (ms / 1000).toFixed(1) + ' s';
    runStatus.textContent = results.length + (results.length === 1 ? ' result' : ' results') + ' in ' + took;
    showResults(text, answer);
    requestPlot(text, id, controller.signal);
  }

  function finishRun() {
    resultsBox.removeAttribute('aria-busy');
    inFlight = null;
  }

  // ---------- errors ----------

  /**
   * The offset in the editor's text (UTF-16 units, as the textarea counts) of a 1-based line and
   * column as the server counts them: lines end at \n, a column is one code point (a tab is one).
   * A column past the end of its line lands at the line's end.
   */
  function offsetOf(text, line, column) {
    const lines = text.split('\n');
    const l = Math.min(Math.max(line, 1), lines.length);
    let offset = 0;
    for (let i = 0; i < l - 1; i++) offset += lines[i].length + 1;
    let col = 1;
    for (const ch of lines[l - 1]) {
      if (col >= column) break;
      offset += ch.length;
      col++;
    }
    return offset;
  }

  /** The end of the word or quoted string starting at offset, so the mistake itself is selected. */
  function tokenEnd(text, start) {
    if (start >= text.length || text[start] === '\n') return start;
    if (text[start] === '"') {
      for (let i = start + 1; i < text.length && text[i] !== '\n'; i++) {
        if (text[i] === '\\') { i++; continue; }
        if (text[i] === '"') return i + 1;
      }
      return start + 1;
    }
    const word = /[A-Za-z0-9_.%\/^*+\-]/;
    if (!word.test(text[start])) return start + 1;
    let i = start;
    while (i < text.length && word.test(text[i])) i++;
    return i;
  }

  function markInEditor(line, column) {
    const text = editor.value;
    const start = offsetOf(text, line, column);
    const end = tokenEnd(text, start);
    editor.focus();
    editor.setSelectionRange(start, end);
    const lineHeight = parseFloat(getComputedStyle(editor).lineHeight) || 20;
    editor.scrollTop = Math.max(0, (line - 2) * lineHeight);
  }

  function showProblem(problem, text) {
    clear(errorBox);
    const hasPosition = Number.isInteger(problem.line) && Number.isInteger(problem.column);
    errorBox.append(el('h3', { text: problem.title || 'The query cannot be run' }));
    if (problem.detail) errorBox.append(el('p', { class: 'problem-detail', text: problem.detail }));
    if (hasPosition) {
      const go = el('button', { type: 'button', class: 'link-button', text: 'Show in the editor' });
      go.addEventListener('click', () => markInEditor(problem.line, problem.column));
      errorBox.append(el('p', { class: 'problem-where' },
        el('span', { class: 'where-text', text: 'Line ' + problem.line + ', column ' + problem.column }), ' ', go));
    }
    if (problem.excerpt) {
      errorBox.append(el('pre', { class: 'excerpt', text: problem.excerpt }));
    }
    if (problem.hint) errorBox.append(el('p', { class: 'problem-hint' }, el('strong', { text: 'Hint: ' }), problem.hint));
    errorBox.hidden = false;
    runStatus.textContent = problem.status ? 'Not run (' + problem.status + ')' : 'Not run';
    clearResults('The results of the last query that ran are cleared, so they cannot be mistaken for this one.');
    if (hasPosition && text === editor.value) markInEditor(problem.line, problem.column);
  }

  // ---------- results ----------

  function clearResults(note) {
    clear(resultsBox);
    clear(cautionsBox);
    resultsBox.append(el('p', { class: 'quiet', text: note }));
    setPlotBlob(null);
    plot.hidden = true;
    shown.text = null;
    for (const b of document.querySelectorAll('.download')) {
      if (b.dataset.kind !== 'query') b.disabled = true;
    }
    downloadStatus.textContent = '';
  }

  function showResults(text, answer) {
    errorBox.hidden = true;
    clear(errorBox);
    clear(resultsBox);
    clear(cautionsBox);
    downloadStatus.textContent = '';
    shown.text = text;
    for (const b of document.querySelectorAll('.download')) b.disabled = false;

    const results = Array.isArray(answer.results) ? answer.results : [];
    const cautions = new Set(Array.isArray(answer.cautions) ? answer.cautions : []);
    for (const r of results) {
      if (r.metadata && r.metadata.caution) cautions.add(r.metadata.caution);
    }
    for (const c of cautions) cautionsBox.append(cautionBox(c));

    if (results.length === 0) {
      resultsBox.append(el('p', { class: 'quiet', text: 'The query ran and returned no results.' }));
    }
    // With several results, each one under a caution repeats it, for readers who scroll straight to it.
    results.forEach((r, i) => resultsBox.append(resultView(r, i, cautions, results.length > 1)));
  }

  /** An answer longer than the page reads: nothing shown, the downloads offered instead. */
  function showTooLarge(text) {
    clearResults('');
    clear(resultsBox);
    errorBox.hidden = true;
    shown.text = text;
    for (const b of document.querySelectorAll('.download')) b.disabled = b.dataset.kind === 'png';
    runStatus.textContent = 'The answer is larger than this page reads';
    resultsBox.append(el('p', { class: 'too-large', role: 'status',
      text: 'The answer is over ' + Math.round(READ_LIMIT_BYTES / 1048576) + ' MB, more than this page shows. ' +
            'Save it with the CSV or Arrow download (the server streams it), or narrow the period or the region.' }));
  }

  function cautionBox(text, compact) {
    // role=note keeps it in the reading order; its colour, border and place above the results make it hard to miss.
    return el('div', { class: compact ? 'caution compact' : 'caution', role: 'note' },
      el('p', { class: 'caution-title', text: 'Caution: public health' }),
      el('p', { class: 'caution-text', text }));
  }

  function resultView(r, index, cautions, repeatCaution) {
    const id = 'result-' + index;
    const kind = r.metadata && r.metadata.result_kind;
    const article = el('article', { class: 'result', 'aria-labelledby': id + '-title' });
    article.append(el('h3', { id: id + '-title', class: 'result-title' },
      el('span', { text: r.title || 'Result ' + (index + 1) }),
      kind ? el('span', { class: 'kind', text: kind }) : null));
    if (repeatCaution && r.metadata && r.metadata.caution) article.append(cautionBox(r.metadata.caution, true));
    const warnings = (r.warnings || []).filter((w) => !cautions.has(w));
    if (warnings.length) {
      const ul = el('ul', { class: 'warnings', 'aria-label': 'Warnings' });
      for (const w of warnings) ul.append(el('li', { text: w }));
      article.append(ul);
    }
    article.append(tableView(r, id));
    if (r.metadata && Object.keys(r.metadata).length) {
      const details = el('details', { class: 'metadata' }, el('summary', { text: 'Metadata' }));
      details.append(definitionList(Object.entries(r.metadata)));
      article.append(details);
    }
    return article;
  }

  function tableView(r, id) {
    const columns = Array.isArray(r.columns) ? r.columns : [];
    const rows = Array.isArray(r.rows) ? r.rows : [];
    const wrap = el('div', { class: 'table-wrap', tabindex: '0', role: 'region', 'aria-labelledby': id + '-title' });
    const table = el('table', { class: 'data' });
    const headRow = el('tr');
    for (const c of columns) {
      const th = el('th', { scope: 'col', class: isNumeric(c) ? 'num' : null }, el('span', { class: 'col-name', text: c.name }));
      if (c.unit) th.append(el('span', { class: 'col-unit', text: c.unit }));
      headRow.append(th);
    }
    table.append(el('thead', {}, headRow));
    const body = el('tbody');
    table.append(body);
    const container = el('div', {}, wrap);
    const count = el('p', { class: 'row-count' });
    const addRows = (from, to) => {
      const frag = document.createDocumentFragment();
      for (let i = from; i < to; i++) frag.append(rowView(rows[i], columns));
      body.append(frag);
    };
    const limit = Math.min(rows.length, MAX_ROWS_SHOWN);
    addRows(0, limit);
    wrap.append(table);
    if (rows.length > limit) {
      count.textContent = 'Showing ' + limit + ' of ' + rows.length + ' rows. ';
      const more = el('button', { type: 'button', class: 'link-button', text: 'Show all ' + rows.length + ' rows' });
      more.addEventListener('click', () => {
        addRows(limit, rows.length);
        count.textContent = rows.length + ' rows';
        wrap.focus();
      });
      count.append(more);
    } else {
      count.textContent = rows.length === 1 ? '1 row' : rows.length + ' rows';
    }
    container.append(count);
    return container;
  }

  function isNumeric(c) {
    return c.type === 'number' || c.type === 'integer';
  }

  function rowView(row, columns) {
    const tr = el('tr');
    columns.forEach((c, j) => {
      const v = row[j];
      if (v === null || v === undefined || (typeof v === 'number' && Number.isNaN(v))) {
        tr.append(el('td', { class: 'missing' }, el('span', { 'aria-hidden': 'true', text: '–' }), el('span', { class: 'sr-only', text: 'missing' })));
        return;
      }
      const td = el('td', { class: isNumeric(c) ? 'num' : null, text: formatValue(v, c) });
      if (typeof v === 'number' && !Number.isInteger(v)) td.title = String(v);
      tr.append(td);
    });
    return tr;
  }

  /** Five significant digits for reading; the full value stays in the cell's title and in the downloads. */
  function formatValue(v, column) {
    if (typeof v !== 'number') return String(v);
    if (Number.isInteger(v) || column.type === 'integer') return String(v);
    const a = Math.abs(v);
    if (a !== 0 && (a >= 1e9 || a < 1e-4)) return v.toExponential(4);
    return String(Number(v.toPrecision(5)));
  }

  // ---------- plot ----------

  function plotSize() {
    const width = Math.round(Math.min(1600, Math.max(320, resultsBox.clientWidth || 800)));
    const height = Math.round(Math.min(900, Math.max(240, width * 0.56)));
    return { width, height };
  }

  function setPlotBlob(blob) {
    if (shown.plotUrl) URL.revokeObjectURL(shown.plotUrl);
    shown.plotBlob = blob;
    shown.plotUrl = blob ? URL.createObjectURL(blob) : null;
  }

  function plotNote(text) {
    clear(plotBody);
    plotBody.append(el('p', { class: 'quiet plot-note', text }));
    plotCaption.textContent = '';
    plot.hidden = false;
  }

  async function requestPlot(text, id, signal) {
    plotNote('Drawing the plot…');
    const size = plotSize();
    let res;
    try {
      res = await postQuery(text, FORMATS.png, size, signal);
    } catch (e) {
      if (id === runCounter) plotNote('No plot: the server could not be reached.');
      return;
    }
    if (id !== runCounter) return;
    const type = res.headers.get('Content-Type') || '';
    if (res.ok && type.startsWith('image/png')) {
      const blob = await res.blob();
      if (id !== runCounter) return;
      setPlotBlob(blob);
      clear(plotBody);
      const titles = Array.from(resultsBox.querySelectorAll('.result-title > span:first-child')).map((s) => s.textContent);
      const img = el('img', { src: shown.plotUrl, alt: 'Plot of ' + (titles.join('; ') || 'the results'), width: String(size.width), height: String(size.height) });
      plotBody.append(img);
      plotCaption.textContent = titles.join('; ');
      plot.hidden = false;
      return;
    }
    const problem = res.ok ? { detail: 'the server sent ' + (type || 'something') + ' instead of a PNG' } : await readProblem(res);
    if (id !== runCounter) return;
    if (res.status === 406) plotNote('No plot: this server does not draw plots.');
    else plotNote('No plot for these results' + (problem.detail ? ': ' + problem.detail : '.'));
  }

  // ---------- downloads ----------

  function saveBlob(blob, name) {
    const url = URL.createObjectURL(blob);
    const a = el('a', { href: url, download: name, class: 'sr-only', text: name });
    document.body.append(a);
    a.click();
    a.remove();
    // The download has started by the time the click returns; keep the URL a while for slow disks.
    setTimeout(() => URL.revokeObjectURL(url), 60000);
  }

  async function download(kind) {
    if (kind === 'query') {
      saveBlob(new Blob([editor.value], { type: TEXT_TYPE }), 'query.swq');
      downloadStatus.textContent = 'Saved the query text as query.swq';
      return;
    }
    const format = FORMATS[kind];
    if (!format || shown.text === null) return;
    if (kind === 'png' && shown.plotBlob) {
      saveBlob(shown.plotBlob, format.file);
      downloadStatus.textContent = 'Saved ' + format.file;
      return;
    }
    downloadStatus.textContent = 'Preparing ' + format.file + '…';
    let res;
    try {
      res = await postQuery(shown.text, format, kind === 'png' ? plotSize() : null);
    } catch (e) {
      downloadStatus.textContent = 'Not saved: the server could not be reached.';
      return;
    }
    if (!res.ok) {
      const p = await readProblem(res);
      downloadStatus.textContent = 'Not saved: ' + (p.detail || p.title);
      return;
    }
    saveBlob(await res.blob(), format.file);
    downloadStatus.textContent = 'Saved ' + format.file;
  }

  // ---------- examples ----------

  async function loadExamples() {
    let examples;
    try {
      const res = await fetch('examples.json');
      examples = await res.json();
    } catch (e) {
      examplesSelect.disabled = true;
      $('use-example').disabled = true;
      return;
    }
    const groups = new Map();
    examples.forEach((ex, i) => {
      if (!groups.has(ex.group)) {
        const g = el('optgroup', { label: ex.group });
        groups.set(ex.group, g);
        examplesSelect.append(g);
      }
      groups.get(ex.group).append(el('option', { value: String(i), text: ex.label }));
    });
    $('use-example').addEventListener('click', () => {
      const i = examplesSelect.value;
      if (i === '') {
        examplesSelect.focus();
        return;
      }
      editor.value = examples[Number(i)].text;
      editor.focus();
      editor.setSelectionRange(editor.value.length, editor.value.length);
    });
    if (!editor.value) editor.value = examples.length ? examples[0].text : '';
  }

  // ---------- catalog ----------

  /** Variables are names (bare); regions are quoted strings in the language, with \ and " escaped. */
  function quoted(name) {
    return '"' + name.replace(/\\/g, '\\\\').replace(/"/g, '\\"') + '"';
  }

  function variableWord(name) {
    return /^[A-Za-z_][A-Za-z0-9_]*$/.test(name) ? name : quoted(name);
  }

  function insertAtCursor(word) {
    const v = editor.value;
    const s = editor.selectionStart;
    const e = editor.selectionEnd;
    let text = word;
    if (s > 0 && !/[\s(]/.test(v[s - 1])) text = ' ' + text;
    if (e < v.length && !/[\s),;]/.test(v[e])) text = text + ' ';
    editor.setRangeText(text, s, e, 'end');
    editor.focus();
  }

  function insertButton(label, word, kind) {
    const b = el('button', { type: 'button', class: 'insert', 'data-name': label, 'data-kind': kind,
                             'aria-label': 'Insert ' + label, text: label });
    b.addEventListener('click', () => insertAtCursor(word));
    return b;
  }

  function dateOnly(s) {
    return typeof s === 'string' ? s.replace(/T.*$/, '') : s;
  }

  function round(x, digits) {
    return typeof x === 'number' ? String(Number(x.toFixed(digits))) : x;
  }

  async function loadCatalog() {
    const list = $('variables');
    try {
      const res = await fetch('/api/cubes', { headers: { Accept: 'application/json' } });
      if (!res.ok) throw new Error((await readProblem(res)).detail);
      const cubes = await res.json();
      clear(list);
      if (!cubes.length) list.append(el('li', { class: 'quiet', text: 'No variables yet: ingest some files first.' }));
      for (const c of cubes) {
        const g = c.grid || {};
        const p = c.provenance || {};
        const details = el('details', { class: 'about' }, el('summary', { text: 'About ' + c.name }),
          definitionList([
            ['Description', c.long_name],
            ['Units', c.units + (c.source_units && c.source_units !== c.units ? ' (source: ' + c.source_units + ')' : '')],
            ['Standard name', c.standard_name],
            ['Period', dateOnly(c.first) + ' to ' + dateOnly(c.last)],
            ['Steps', c.steps],
            ['Calendar', c.calendar + (c.time_alignment ? ' (' + c.time_alignment + ')' : '')],
            ['Grid', g.rows + ' × ' + g.columns + ' cells'],
            ['Extent', round(g.south, 3) + ' to ' + round(g.north, 3) + ' °N, ' + round(g.west, 3) + ' to ' + round(g.east, 3) + ' °E'],
            ['Source file', p.source_file],
            ['Source variable', p.source_variable],
            ['Reader', p.reader],
            ['SHA-256', p.source_sha256],
            ['Ingested', p.ingested_at],
            ['Version', c.version],
          ]));
        list.append(el('li', { class: 'entry' },
          el('div', { class: 'entry-head' }, insertButton(c.name, variableWord(c.name), 'variable'),
            el('span', { class: 'unit', text: c.units })),
          details));
      }
    } catch (e) {
      clear(list);
      list.append(el('li', { class: 'quiet', text: 'The variables could not be loaded: ' + e.message }));
    }
  }

  async function loadRegions() {
    const list = $('regions');
    try {
      const res = await fetch('/api/regions', { headers: { Accept: 'application/geo+json, application/json' } });
      if (!res.ok) throw new Error((await readProblem(res)).detail);
      const fc = await res.json();
      const features = Array.isArray(fc.features) ? fc.features : [];
      clear(list);
      if (!features.length) list.append(el('li', { class: 'quiet', text: 'No regions yet.' }));
      for (const f of features) {
        const props = f.properties || {};
        if (!props.name) continue;
        const facts = [];
        if (props.kind) facts.push(props.kind);
        if (typeof props.area_km2 === 'number') facts.push(round(props.area_km2, props.area_km2 < 100 ? 1 : 0) + ' km²');
        if (typeof props.radius_m === 'number') facts.push('radius ' + round(props.radius_m / 1000, 2) + ' km');
        if (props.segment) facts.push('in ' + props.segment);
        list.append(el('li', { class: 'entry' },
          el('div', { class: 'entry-head' }, insertButton(props.name, quoted(props.name), 'region'),
            el('span', { class: 'unit', text: facts.join(', ') }))));
      }
    } catch (e) {
      clear(list);
      list.append(el('li', { class: 'quiet', text: 'The regions could not be loaded: ' + e.message }));
    }
  }

  // ---------- wiring ----------

  editor.addEventListener('keydown', (e) => {
    if (e.key === 'Enter' && (e.ctrlKey || e.metaKey)) {
      e.preventDefault();
      run();
    }
  });
  runButton.addEventListener('click', run);
  for (const b of document.querySelectorAll('.download')) {
    b.addEventListener('click', () => download(b.dataset.kind));
  }

  // On a narrow screen the catalog sits between the editor and the results: start it folded.
  if (window.matchMedia('(max-width: 52rem)').matches) {
    for (const d of document.querySelectorAll('.browser-group')) d.open = false;
  }

  loadExamples();
  loadCatalog();
  loadRegions();
})();
