// coldroom serve: the page. Plain JavaScript, no framework, nothing fetched from elsewhere.
// Every answer is the server's (the commands' own documents); this script only lays them out.
'use strict';
(function () {
  const token = new URLSearchParams(location.search).get('token') || '';
  const $ = (id) => document.getElementById(id);
  const text = $('text'), gutter = $('gutter'), answers = $('answers'), state = $('state');
  const problems = document.createElement('div');
  problems.id = 'problems';
  $('editor').appendChild(problems);
  let project = null, timer = null, generation = 0, errorLine = null;

  function el(tag, attrs, ...children) {
    const node = document.createElement(tag);
    for (const [k, v] of Object.entries(attrs || {})) {
      if (k === 'class') node.className = v; else node.setAttribute(k, v);
    }
    for (const c of children) if (c !== null && c !== undefined) node.append(c instanceof Node ? c : String(c));
    return node;
  }
  async function call(path, body) {
    const response = await fetch(path, {
      method: body === undefined ? 'GET' : 'POST',
      headers: { 'X-Coldroom-Token': token, 'Content-Type': 'text/plain; charset=utf-8' },
      body: body,
    });
    return response;
  }
  function say(message, kind) {
    state.textContent = message;
    state.className = kind || '';
  }

  // --- the text and its line numbers ---------------------------------------------------------
  function drawGutter() {
    const lines = text.value.split('\n').length;
    const parts = [];
    for (let i = 1; i <= lines; i++) parts.push(i === errorLine ? '\u0000' + i : String(i));
    gutter.textContent = '';
    for (const p of parts) {
      if (p[0] === '\u0000') gutter.append(el('span', { class: 'err' }, p.slice(1)), '\n');
      else gutter.append(p + '\n');
    }
    gutter.scrollTop = text.scrollTop;
  }
  text.addEventListener('scroll', () => { gutter.scrollTop = text.scrollTop; });
  text.addEventListener('input', () => {
    drawGutter();
    clearTimeout(timer);
    timer = setTimeout(refresh, 600);
  });
  text.addEventListener('keydown', (event) => {
    if (event.key === 'Tab') {  // two spaces, as YAML wants
      event.preventDefault();
      text.setRangeText('  ', text.selectionStart, text.selectionEnd, 'end');
      text.dispatchEvent(new Event('input'));
    }
  });
  function goToLine(line) {
    const lines = text.value.split('\n');
    let at = 0;
    for (let i = 0; i < line - 1 && i < lines.length; i++) at += lines[i].length + 1;
    text.focus();
    text.setSelectionRange(at, at + (lines[line - 1] || '').length);
    text.scrollTop = Math.max(0, (line - 5) * 18);
  }

  // --- numbers ---------------------------------------------------------------------------------
  const fixed = (v, d) => (v === null || v === undefined ? '—' : Number(v).toFixed(d));
  const watts = (v) => (v === null || v === undefined ? '—' : Math.abs(v) >= 10000 ? fixed(v / 1000, 1) + ' kW' : fixed(v, 0) + ' W');
  function figure(value, label) { return el('div', { class: 'figure' }, el('b', {}, value), el('span', {}, label)); }

  // --- the answers -------------------------------------------------------------------------------
  const PASSING = new Set(['within', 'ok', 'holds', 'pass', 'adequate', 'meets']);
  function verdicts(doc) {
    const found = [];
    (function walk(node, where) {
      if (Array.isArray(node)) { node.forEach((n) => walk(n, where)); return; }
      if (!node || typeof node !== 'object') return;
      const here = node.name || node.room || where;
      if (typeof node.verdict === 'string') {
        found.push({ where: here, verdict: node.verdict, detail: node.working || node.message || node.rule || '' });
      }
      if (node.suitable === false) {
        found.push({ where: here, verdict: 'not suitable', detail: node.not_suitable_reason || '' });
      }
      if (node.meets_asked_time === false && node.asked_time_h !== undefined) {
        found.push({ where: here, verdict: 'pull-down too slow',
          detail: `${fixed(node.time_to_final_temperature_h, 1)} h against ${fixed(node.asked_time_h, 1)} h asked` });
      }
      for (const [k, v] of Object.entries(node)) if (k !== 'states') walk(v, here);
    })(doc, '');
    return found;
  }
  function roomBars(room) {
    const loads = Object.entries(room.loads_w || {});
    const top = Math.max(1, ...loads.map(([, v]) => Math.abs(v)));
    const grid = el('div', { class: 'bars' });
    for (const [name, value] of loads) {
      const bar = el('div', { class: 'bar' });
      bar.style.width = (100 * Math.abs(value) / top).toFixed(1) + '%';
      grid.append(el('span', {}, name.replace(/_/g, ' ')), el('div', {}, bar), el('span', { class: 'value' }, watts(value)));
    }
    return grid;
  }
  function render(doc, extras) {
    const out = [];
    const p = doc.project || {};
    out.push(el('h2', {}, p.name || 'Project'));
    const systems = doc.systems || [], rooms = doc.rooms || [];
    const total = systems.reduce((s, x) => s + (x.design_capacity_w || 0), 0);
    const summary = el('div', { class: 'summary' },
      figure(String(rooms.length), 'rooms'), figure(String(systems.length), 'systems'),
      figure(watts(total), 'design capacity, all systems'),
      figure(fixed(systems.reduce((s, x) => s + (x.daily_electricity_kwh || 0), 0), 1) + ' kWh', 'electricity per day'));
    out.push(summary);
    const found = verdicts(doc);
    const blocking = found.filter((v) => !PASSING.has(v.verdict.toLowerCase()));
    out.push(el('h3', {}, blocking.length ? `Blocking verdicts (${blocking.length})` : 'Verdicts: nothing blocks the job'));
    for (const v of found) {
      out.push(el('div', { class: 'verdict' + (PASSING.has(v.verdict.toLowerCase()) ? '' : ' block') },
        el('b', {}, `${v.where}: ${v.verdict}`), v.detail ? ' — ' + v.detail : ''));
    }
    systems.forEach((s, i) => {
      out.push(el('h2', {}, `System ${s.name} · ${s.refrigerant}`));
      out.push(el('div', { class: 'summary' },
        figure(watts(s.design_capacity_w), 'design duty'),
        figure(`${fixed(s.suction_temperature_c, 1)} / ${fixed(s.condensing_temperature_c, 1)} °C`, 'suction / condensing'),
        figure(watts(s.heat_of_rejection_w), 'heat of rejection'),
        figure(watts(s.compressor_input_power_w), 'compressor input'),
        figure(s.cycle ? fixed(s.cycle.cop, 2) : '—', 'COP'),
        figure(watts(s.connected_load_w), 'connected load' + (s.connected_load_case ? ` (${s.connected_load_case})` : '')),
        figure(fixed(s.compressor_daily_run_time_h, 1) + ' h', 'compressor run per day'),
        figure(fixed(s.daily_electricity_kwh, 1) + ' kWh', 'electricity per day')));
      if (s.members && s.members.length) {
        const t = el('table', {}, el('tr', {}, el('th', {}, 'room'), el('th', {}, 'evaporating °C'), el('th', {}, 'duty')));
        for (const m of s.members) t.append(el('tr', {}, el('td', {}, m.room), el('td', {}, fixed(m.evaporating_temperature_c, 1)), el('td', {}, watts(m.duty_w))));
        out.push(t);
      }
      const chart = el('div', { class: 'chart', 'data-system': String(i) });
      out.push(chart);
      if (extras.charts[i]) chart.append(el('img', { src: extras.charts[i], alt: `p–h chart of ${s.name}` }));
    });
    out.push(el('h2', {}, 'Rooms'));
    for (const r of rooms) {
      out.push(el('h3', {}, `${r.name}: required ${watts(r.required_capacity_w)}, design ${watts(r.design_capacity_w)}` +
        (r.system ? ` on ${r.system}` : '')));
      out.push(roomBars(r));
    }
    const notes = [...(doc.warnings || [])];
    for (const s of systems) for (const w of s.warnings || []) notes.push(`${s.name}: ${w}`);
    for (const r of rooms) for (const w of r.warnings || []) notes.push(`${r.name}: ${w}`);
    for (const s of systems) if (s.cycle) for (const w of s.cycle.warnings || []) notes.push(`${s.name}: ${w}`);
    for (const w of extras.warnings) notes.push(`${w.key}: ${w.message}`);
    out.push(el('h2', {}, `Warnings and cautions (${notes.length})`));
    for (const n of notes) out.push(el('div', { class: 'note' }, typeof n === 'string' ? n : JSON.stringify(n)));
    if (extras.compare) out.push(...compareTable(extras.compare));
    if (extras.quote) out.push(...quoteTotals(extras.quote));
    answers.replaceChildren(...out);
  }
  function compareTable(doc) {
    if (doc.error) return [el('h2', {}, 'Options'), el('div', { class: 'note' }, doc.error)];
    const rows = doc.options || doc.results || [];
    if (!rows.length) return [];
    const keys = Object.keys(rows[0]).filter((k) => typeof rows[0][k] !== 'object');
    const t = el('table', {}, el('tr', {}, ...keys.map((k) => el('th', {}, k.replace(/_/g, ' ')))));
    for (const r of rows) t.append(el('tr', {}, ...keys.map((k) => el('td', {}, typeof r[k] === 'number' ? fixed(r[k], Math.abs(r[k]) < 10 ? 2 : 0) : r[k]))));
    return [el('h2', {}, 'Options'), t];
  }
  function quoteTotals(doc) {
    if (doc.error) return [el('h2', {}, 'Selection and quote'), el('div', { class: 'note' }, doc.error)];
    const q = doc.quote || {};
    const out = [el('h2', {}, `Selection and quote (${doc.catalogue})`)];
    out.push(el('div', { class: 'summary' },
      figure(fixed(q.subtotal_price, 2) + ' ' + (q.currency || ''), 'subtotal'),
      figure(fixed(q.margin_price, 2), 'margin'), figure(fixed(q.tax_price, 2), 'tax'),
      figure(fixed(q.total_price, 2) + ' ' + (q.currency || ''), 'total'),
      figure(q.complete ? 'yes' : `no: ${(q.missing_prices || []).length} price(s) missing`, 'complete')));
    return out;
  }
  function showErrors(errors) {
    problems.replaceChildren(...errors.map((e) => {
      const row = el('div', {}, e.text || `${e.line}:${e.column}: ${e.key}: ${e.message}`);
      if (e.line) row.addEventListener('click', () => goToLine(e.line));
      return row;
    }));
    errorLine = errors.length && errors[0].line ? errors[0].line : null;
    drawGutter();
  }
  function markStale(reason) {
    answers.classList.add('stale');
    let note = answers.querySelector('.stale-note');
    if (!note) { note = el('div', { class: 'stale-note' }); answers.prepend(note); }
    note.textContent = reason;
  }
  async function chart(i, body) {
    const r = await call(`/api/cycle.svg?system=${i}`, body);
    if (!r.ok) return null;
    return URL.createObjectURL(await r.blob());
  }
  async function refresh() {
    const mine = ++generation;
    const body = text.value;
    say('checking…', 'busy');
    const checked = await (await call('/api/validate', body)).json();
    if (mine !== generation) return;
    showErrors(checked.errors || []);
    if (!checked.valid) {
      const e = checked.errors[0];
      say(`error at line ${e.line}`, 'bad');
      markStale(`Stale: these answers are for the last valid text; line ${e.line}: ${e.message}`);
      return;
    }
    say('computing…', 'busy');
    const sized = await call('/api/size', body);
    if (mine !== generation) return;
    if (!sized.ok) {
      const e = await sized.json();
      say('cannot size', 'bad');
      if (e.errors) showErrors(e.errors);
      markStale('Stale: ' + (e.error || 'the text cannot be sized'));
      return;
    }
    const doc = await sized.json();
    const extras = { warnings: checked.warnings || [], charts: [], compare: null, quote: null };
    const charts = await Promise.all((doc.systems || []).map((s, i) => chart(i, body)));
    extras.charts = charts;
    if (/^options\s*:/m.test(body)) {
      const r = await call('/api/compare', body);
      extras.compare = await r.json();
    }
    const catalogue = $('catalogue').value;
    if (catalogue) {
      const r = await call('/api/quote?catalogue=' + encodeURIComponent(catalogue), body);
      extras.quote = await r.json();
    }
    if (mine !== generation) return;
    answers.classList.remove('stale');
    render(doc, extras);
    say('up to date');
  }

  // --- save and downloads ----------------------------------------------------------------------
  $('save').addEventListener('click', async () => {
    let path = '/api/save';
    if (!project.file) {
      const name = prompt('Save the new project as (a file name ending in .yaml, in the folder coldroom serve was started from):', 'project.yaml');
      if (!name) return;
      path += '?name=' + encodeURIComponent(name);
    }
    const r = await call(path, text.value);
    const answer = await r.json();
    if (r.ok) {
      project.file = answer.saved;
      $('file').textContent = answer.saved;
      say(answer.backup ? `saved; previous version in ${answer.backup}` : `saved as ${answer.saved}`);
    } else {
      say('not saved', 'bad');
      alert(answer.error);
    }
  });
  async function fetchFile(path, name) {
    const r = await call(path, text.value);
    if (!r.ok) { const e = await r.json(); say('no download', 'bad'); alert(e.error); return; }
    const url = URL.createObjectURL(await r.blob());
    const a = el('a', { href: url, download: name });
    document.body.append(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(url), 10000);
  }
  const stem = () => ((project && project.file) || 'starter.yaml').split('/').pop().replace(/\.ya?ml$/i, '');
  $('get-pdf').addEventListener('click', () => fetchFile('/api/download/sheet.pdf', stem() + '.pdf'));
  $('get-json').addEventListener('click', () => fetchFile('/api/download/size.json', stem() + '.json'));
  const withCatalogue = (path) => path + '?catalogue=' + encodeURIComponent($('catalogue').value);
  $('get-proposal').addEventListener('click', () => fetchFile(withCatalogue('/api/download/proposal.pdf'), stem() + '-proposal.pdf'));
  $('get-costing').addEventListener('click', () => fetchFile(withCatalogue('/api/download/costing.xlsx'), stem() + '-costing.xlsx'));
  $('catalogue').addEventListener('change', () => {
    const chosen = !!$('catalogue').value;
    $('get-proposal').disabled = !chosen;
    $('get-costing').disabled = !chosen;
    refresh();
  });

  // --- start ---------------------------------------------------------------------------------------
  (async function start() {
    const r = await call('/api/project');
    project = await r.json();
    $('file').textContent = project.file || '(new project: not saved yet)';
    for (const name of project.catalogues) $('catalogue').append(el('option', { value: name }, name));
    text.value = project.text;
    drawGutter();
    refresh();
  })();
})();
