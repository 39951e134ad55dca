/* Draws every figure of a tristim report with the Plotly copy loaded before this script (unpacked by plotly-loader.js when embedded), then marks <body data-figures="drawn">. No network access. */
(function () {
  "use strict";
  var sans = 'system-ui, -apple-system, "Segoe UI", Roboto, "Noto Sans", "Helvetica Neue", Arial, sans-serif';
  var base = {
    font: { family: sans, size: 13, color: "#1d2127" },
    paper_bgcolor: "rgba(0,0,0,0)",
    plot_bgcolor: "rgba(0,0,0,0)",
    margin: { l: 64, r: 24, t: 36, b: 56 },
    colorway: ["#2f4f86", "#c0582b", "#3f8f5a", "#8d4a9e", "#b48a1c", "#3a8da6", "#a33a52", "#5d6670"],
    xaxis: { gridcolor: "#e7eaee", zerolinecolor: "#c9ced5", linecolor: "#5a6470", ticks: "outside", automargin: true },
    yaxis: { gridcolor: "#e7eaee", zerolinecolor: "#c9ced5", linecolor: "#5a6470", ticks: "outside", automargin: true },
    legend: { bgcolor: "rgba(255,255,255,0.7)" }
  };
  function merge(target, source) {
    var out = {}, key;
    for (key in target) out[key] = target[key];
    for (key in source) {
      var a = out[key], b = source[key];
      out[key] = a && b && typeof a === "object" && typeof b === "object" && !Array.isArray(a) && !Array.isArray(b) ? merge(a, b) : b;
    }
    return out;
  }
  function drawAll(problem) {
    var nodes = document.querySelectorAll(".plot[data-spec]");
    var drawing = [];
    for (var i = 0; i < nodes.length; i++) {
      var node = nodes[i];
      if (typeof window.Plotly === "undefined") {
        node.innerHTML = '<p class="plot-missing">This figure needs the Plotly script, which did not load' + (problem ? ": " + String(problem.message || problem).replace(/[&<>]/g, "") : "") + ".</p>";
        continue;
      }
      try {
        var spec = JSON.parse(document.getElementById(node.getAttribute("data-spec")).textContent);
        var layout = merge(base, spec.layout || {});
        var axes = Object.keys(spec.layout || {}).filter(function (k) { return /^[xy]axis\d+$/.test(k); });
        axes.forEach(function (k) { layout[k] = merge(base[k.charAt(0) + "axis"], spec.layout[k]); });
        var config = merge({ displaylogo: false, responsive: true, showLink: false, showEditInChartStudio: false }, spec.config || {});
        drawing.push(window.Plotly.newPlot(node, spec.data, layout, config));
      } catch (e) {
        node.innerHTML = '<p class="plot-missing">This figure could not be drawn: ' + String(e && e.message || e).replace(/[&<>]/g, "") + "</p>";
      }
    }
    Promise.all(drawing).then(
      function () { document.body.setAttribute("data-figures", "drawn"); },
      function () { document.body.setAttribute("data-figures", "failed"); }
    );
  }
  (window.tristimPlotlyReady || Promise.resolve()).then(function () { drawAll(); }, drawAll);
})();
