/* Unpacks the Plotly copy embedded above it (gzip, as seven-bit text: runner/report/seven-bit-text.ts) with the browser's DecompressionStream and runs it; figures-client.js waits for window.tristimPlotlyReady. No network access. */
(function () {
  "use strict";
  var packed = document.getElementById("tristim-plotly-gzip");
  window.tristimPlotlyReady = new Promise(function (resolve, reject) {
    if (window.Plotly || !packed) return resolve();
    if (typeof DecompressionStream === "undefined") return reject(new Error("this browser has no DecompressionStream, which unpacks the embedded Plotly; open the report in a current browser"));
    var text = packed.textContent, length = Number(packed.getAttribute("data-bytes"));
    var escaped = [0, 13, 60], bytes = new Uint8Array(length), buffer = 0, bits = 0, at = 0;
    function push(group) {
      buffer = ((buffer << 7) | group) & 0x7fff;
      bits += 7;
      if (bits >= 8 && at < length) {
        bits -= 8;
        bytes[at++] = (buffer >> bits) & 255;
      }
    }
    for (var i = 0; i < text.length && at < length; i++) {
      var c = text.charCodeAt(i);
      if (c < 128) push(c);
      else {
        push(escaped[(c >> 7) - 1]);
        push(c & 127);
      }
    }
    if (at < length) return reject(new Error("the embedded Plotly copy is damaged (" + at + " of " + length + " bytes)"));
    new Response(new Blob([bytes]).stream().pipeThrough(new DecompressionStream("gzip"))).text().then(function (code) {
      var script = document.createElement("script");
      script.textContent = code;
      document.head.appendChild(script);
      resolve();
    }, reject);
  });
})();
