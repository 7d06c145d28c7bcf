/**
 * Inline page script (vanilla, no data): sorts the comparison table on a header click, opens a row's notes, hides rows
 * by status through classes on the table (cells sort by data-s when present, else by their text),
 * and draws the collapsed waveform figures from their <template> when that block is opened.
 */
export const SCRIPT = `(function () {
  var table = document.getElementById('cmp');
  if (!table) return;
  var body = table.tBodies[0];
  var count = document.getElementById('cmp-count');
  var boxes = Array.prototype.slice.call(document.querySelectorAll('#cmp-filter input[data-status]'));
  var total = body.rows.length;
  function key(cell) {
    var s = cell.getAttribute('data-s');
    var v = s !== null ? s : cell.textContent.trim();
    if (v === '' || v === '\\u2013') return null;
    var m = /^[+-]?(\\d+\\.?\\d*|\\.\\d+)(e[+-]?\\d+)?/i.exec(v);
    return m ? Number(m[0]) : v.toLowerCase();
  }
  table.tHead.addEventListener('click', function (e) {
    var b = e.target.closest ? e.target.closest('button[data-col]') : null;
    if (!b) return;
    var th = b.parentNode, col = Number(b.getAttribute('data-col'));
    var dir = th.getAttribute('aria-sort') === 'ascending' ? -1 : 1;
    Array.prototype.forEach.call(table.tHead.querySelectorAll('th[aria-sort]'), function (h) { h.removeAttribute('aria-sort'); });
    th.setAttribute('aria-sort', dir > 0 ? 'ascending' : 'descending');
    var rows = Array.prototype.map.call(body.rows, function (r, i) { return { r: r, k: key(r.cells[col]), i: i }; });
    rows.sort(function (a, b) {
      if (a.k === null || b.k === null) return a.k === b.k ? a.i - b.i : a.k === null ? 1 : -1;
      var na = typeof a.k === 'number', nb = typeof b.k === 'number';
      var c = na && nb ? a.k - b.k : na ? -1 : nb ? 1 : a.k < b.k ? -1 : a.k > b.k ? 1 : 0;
      return c * dir || a.i - b.i;
    });
    var frag = document.createDocumentFragment();
    rows.forEach(function (x) { frag.appendChild(x.r); });
    body.appendChild(frag);
  });
  body.addEventListener('click', function (e) {
    var b = e.target.closest ? e.target.closest('button.more') : null;
    if (!b) return;
    var open = b.parentNode.classList.toggle('open');
    b.setAttribute('aria-expanded', String(open));
  });
  function update() {
    var hidden = 0;
    boxes.forEach(function (box) {
      table.classList.toggle('hide-' + box.getAttribute('data-status'), !box.checked);
      if (!box.checked) hidden += Number(box.getAttribute('data-n'));
    });
    if (count) count.textContent = (total - hidden) + ' of ' + total + ' corners shown';
  }
  boxes.forEach(function (box) { box.addEventListener('change', update); });
})();
(function () {
  var more = document.getElementById('more-waves');
  if (!more) return;
  function draw() {
    var t = more.querySelector('template');
    if (t) t.replaceWith(t.content);
  }
  more.addEventListener('toggle', function () { if (more.open) draw(); });
  function reveal(id) {
    var t = more.querySelector('template');
    if (id && !document.getElementById(id) && t && t.content.getElementById(id)) { more.open = true; draw(); }
  }
  document.addEventListener('click', function (e) {
    var a = e.target.closest ? e.target.closest('a[href^="#w-"]') : null;
    if (a) reveal(a.getAttribute('href').slice(1));
  });
  if (location.hash.length > 1) {
    var id = decodeURIComponent(location.hash.slice(1));
    reveal(id);
    var el = document.getElementById(id);
    if (el) el.scrollIntoView();
  }
})();`;
