// Optional enhancement of the catalog index: a filter box and sortable columns.
// The table is complete without it.
(function () {
  var bar = document.querySelector('.filter-bar');
  var input = document.getElementById('catalog-filter');
  if (!bar || !input) return;
  bar.hidden = false;
  var rows = Array.prototype.slice.call(document.querySelectorAll('.catalog-table tbody tr'));
  input.addEventListener('input', function () {
    var q = input.value.trim().toLowerCase();
    rows.forEach(function (r) {
      r.hidden = q !== '' && (r.getAttribute('data-search') + ' ' + r.textContent.toLowerCase()).indexOf(q) < 0;
    });
  });
  Array.prototype.forEach.call(document.querySelectorAll('table.sortable'), function (table) {
    Array.prototype.forEach.call(table.querySelectorAll('thead th'), function (th, col) {
      th.classList.add('sortable-header');
      th.setAttribute('aria-sort', 'none');
      th.addEventListener('click', function () {
        var body = table.tBodies[0];
        var up = th.getAttribute('aria-sort') !== 'ascending';
        var sorted = Array.prototype.slice.call(body.rows).sort(function (a, b) {
          var x = a.cells[col].textContent.trim(), y = b.cells[col].textContent.trim();
          return (up ? 1 : -1) * x.localeCompare(y, undefined, { numeric: true });
        });
        sorted.forEach(function (r) { body.appendChild(r); });
        th.setAttribute('aria-sort', up ? 'ascending' : 'descending');
      });
    });
  });
})();
