/*
 * cellbasis design-basis document: draws every chart of the page with Chart.js from the JSON
 * description beside its canvas (lib/report/charts/spec.ts), without animation and at the fixed
 * size of its box, then marks the page ready for printing: documentElement.dataset.chartsReady.
 * Before the page is printed it opens every data table and draws every chart again: Chromium
 * records a canvas drawn during beforeprint as vector operations, so the printed charts are
 * lines and text, sharp at any zoom and searchable, not bitmaps (measured: a third less
 * printing time and PDF size).
 */
(function () {
  'use strict';

  // Our palette: ink blue, brick, moss, ochre, heather, teal, rose; slate for reference lines, near-black for the design point.
  var PALETTE = ['#1f3a5f', '#a4462e', '#4d7342', '#8a6a1c', '#6b4f7d', '#2a6f73', '#8c3b5e'];
  var REFERENCE = '#6a737b';
  var MARKER = '#111111';
  var DASHES = [[], [6, 3], [2, 2], [8, 3, 2, 3]];
  var FONT = { family: '"Helvetica Neue", Arial, "Liberation Sans", "DejaVu Sans", sans-serif', size: 11 };

  function colour(series) {
    if (series.reference) return REFERENCE;
    if (series.marker) return MARKER;
    return PALETTE[series.style % PALETTE.length];
  }

  // Powers of ten only on logarithmic axes.
  function logTick(value) {
    var exponent = Math.log10(value);
    if (Math.abs(exponent - Math.round(exponent)) > 1e-9) return '';
    return Number(value.toPrecision(1)).toString();
  }

  // Tick labels in the document's number style (lib/report/format.ts): the minus sign U+2212, no
  // thousands comma, digits grouped by a narrow no-break space from five digits up.
  function linearTick(value, index, ticks) {
    var text = Chart.Ticks.formatters.numeric.call(this, value, index, ticks).replace(/,/g, '');
    var parts = /^(-?)(\d+)(.*)$/.exec(text);
    if (!parts) return text;
    var whole = parts[2].length >= 5 ? parts[2].replace(/\B(?=(\d{3})+$)/g, '\u202f') : parts[2];
    return (parts[1] && Number(value) !== 0 ? '\u2212' : '') + whole + parts[3];
  }

  function axis(spec, position) {
    var scale = {
      type: spec.log ? 'logarithmic' : 'linear',
      position: position,
      title: { display: true, text: spec.title, font: FONT, color: '#222' },
      ticks: spec.log ? { font: FONT, color: '#333', callback: logTick, autoSkip: false } : { font: FONT, color: '#333', callback: linearTick },
      grid: { color: position === 'right' ? 'transparent' : '#dcdcdc' },
      border: { color: '#555' }
    };
    if (!spec.log) scale.grace = '6%';
    if (typeof spec.min === 'number') scale.min = spec.min;
    if (typeof spec.max === 'number') scale.max = spec.max;
    if (typeof spec.step === 'number') scale.ticks.stepSize = spec.step;
    return scale;
  }

  // A small drawing of the line as the legend shows it, dash pattern included.
  function legendLine(c, width, dash) {
    var icon = document.createElement('canvas');
    icon.width = 24;
    icon.height = 6;
    var g = icon.getContext('2d');
    g.strokeStyle = c;
    g.lineWidth = width;
    g.setLineDash(dash);
    g.beginPath();
    g.moveTo(0, 3);
    g.lineTo(24, 3);
    g.stroke();
    return icon;
  }

  // The design-point cross of the legend, at its own size rather than stretched to the line icons' width.
  function legendCross() {
    var icon = document.createElement('canvas');
    icon.width = 24;
    icon.height = 10;
    var g = icon.getContext('2d');
    g.strokeStyle = MARKER;
    g.lineWidth = 2;
    g.beginPath();
    g.moveTo(7, 0); g.lineTo(17, 10);
    g.moveTo(17, 0); g.lineTo(7, 10);
    g.stroke();
    return icon;
  }

  function legendLabels(chart) {
    var items = window.Chart.defaults.plugins.legend.labels.generateLabels(chart);
    items.forEach(function (item) {
      if (chart.data.datasets[item.datasetIndex].isMarker) item.pointStyle = legendCross();
    });
    return items.sort(function (a, b) { return a.datasetIndex - b.datasetIndex; });
  }

  function lineDataset(series, index) {
    var c = colour(series);
    var points = series.points.map(function (p) { return { x: p[0], y: p[1] }; });
    if (series.marker) {
      return {
        label: series.label, data: points, yAxisID: series.right ? 'y2' : 'y', showLine: false,
        pointStyle: 'crossRot', pointRadius: 7, pointBorderWidth: 2, borderColor: c, backgroundColor: c, order: 0, clip: false, isMarker: true
      };
    }
    var width = series.reference ? 1 : 1.8;
    var dash = series.dashed ? DASHES[1 + (index % 3)] : [];
    return {
      label: series.label, data: points, yAxisID: series.right ? 'y2' : 'y', showLine: true,
      borderColor: c, backgroundColor: c, borderWidth: width, pointStyle: legendLine(c, width, dash),
      borderDash: dash, pointRadius: 0, tension: 0, order: 1
    };
  }

  function lineConfig(spec) {
    var scales = { x: axis(spec.x, 'bottom'), y: axis(spec.y, 'left') };
    if (spec.y2) scales.y2 = axis(spec.y2, 'right');
    return { type: 'scatter', data: { datasets: spec.series.map(lineDataset) }, options: { scales: scales } };
  }

  function tornadoConfig(spec) {
    return {
      type: 'bar',
      data: {
        labels: spec.categories,
        datasets: [
          { label: spec.lowLabel, data: spec.low, backgroundColor: PALETTE[0], borderColor: PALETTE[0], pointStyle: 'rect', barPercentage: 0.8, categoryPercentage: 0.7 },
          { label: spec.highLabel, data: spec.high, backgroundColor: PALETTE[1], borderColor: PALETTE[1], pointStyle: 'rect', barPercentage: 0.8, categoryPercentage: 0.7 }
        ]
      },
      options: { indexAxis: 'y', scales: { x: axis(spec.x, 'bottom'), y: { ticks: { font: FONT, color: '#222' }, grid: { display: false } } } }
    };
  }

  function stackedConfig(spec) {
    return {
      type: 'bar',
      data: {
        labels: spec.categories,
        datasets: spec.parts.map(function (p, i) {
          return { label: p.label, data: p.values, backgroundColor: PALETTE[i % PALETTE.length], borderColor: '#fff', borderWidth: 1, pointStyle: 'rect', barPercentage: 0.8, categoryPercentage: 0.9 };
        })
      },
      options: { indexAxis: 'y', scales: { x: Object.assign(axis(spec.x, 'bottom'), { stacked: true }), y: { stacked: true, ticks: { font: FONT, color: '#222' }, grid: { display: false } } } }
    };
  }

  function draw(script) {
    var spec = JSON.parse(script.textContent);
    var canvas = document.getElementById(script.getAttribute('data-canvas'));
    if (!canvas) throw new Error('chart canvas ' + script.getAttribute('data-canvas') + ' is missing');
    var config = spec.kind === 'tornado' ? tornadoConfig(spec) : spec.kind === 'stacked' ? stackedConfig(spec) : lineConfig(spec);
    config.options.animation = false;
    config.options.responsive = false;
    config.options.maintainAspectRatio = false;
    config.options.devicePixelRatio = 2;
    config.options.events = [];
    config.options.plugins = {
      legend: {
        position: 'top', align: 'start',
        labels: { font: FONT, color: '#222', usePointStyle: true, pointStyleWidth: 24, boxHeight: 8, padding: 12, generateLabels: legendLabels }
      },
      tooltip: { enabled: false }
    };
    return new window.Chart(canvas, config);
  }

  function openDataTables() {
    var all = document.querySelectorAll('details');
    for (var i = 0; i < all.length; i++) all[i].open = true;
  }

  var charts = [];

  function redrawCharts() {
    for (var i = 0; i < charts.length; i++) charts[i].draw();
  }

  window.addEventListener('beforeprint', function () {
    openDataTables();
    redrawCharts();
  });
  if (window.matchMedia) {
    var print = window.matchMedia('print');
    if (print.addEventListener) print.addEventListener('change', function (e) { if (e.matches) openDataTables(); });
  }

  var specs = document.querySelectorAll('script.chart-spec');
  for (var i = 0; i < specs.length; i++) charts.push(draw(specs[i]));
  document.documentElement.dataset.chartsReady = 'true';
})();
