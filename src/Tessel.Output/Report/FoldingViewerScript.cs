namespace Tessel.Output.Report;

/// <summary>The report's JavaScript, inlined into the page: plain ES5-style code and canvas 2D, no
/// libraries and no network, so the report opens anywhere, offline, years later.</summary>
internal static class FoldingViewerScript
{
    /// <summary>Runs first, in the head: records every error and console error from then on, and on
    /// load answers the <c>#selftest</c> hash by running the viewer's self-test.</summary>
    public const string Probe = """
(function () {
  'use strict';
  var probe = { errors: [] };
  window.tesselProbe = probe;
  window.onerror = function (message, source, line, column) {
    probe.errors.push(String(message) + ' (line ' + line + ', column ' + column + ')');
  };
  window.addEventListener('unhandledrejection', function (event) {
    probe.errors.push('unhandled rejection: ' + String(event.reason));
  });
  var consoleError = console.error;
  console.error = function () {
    probe.errors.push('console.error: ' + Array.prototype.join.call(arguments, ' '));
    return consoleError.apply(console, arguments);
  };
  window.addEventListener('load', function () {
    if (location.hash !== '#selftest') return;
    var result = { ran: false };
    try {
      if (typeof window.tesselRunSelfTest !== 'function') throw new Error('viewer did not start');
      var r = window.tesselRunSelfTest();
      for (var key in r) if (Object.prototype.hasOwnProperty.call(r, key)) result[key] = r[key];
      result.ran = true;
    } catch (e) {
      probe.errors.push('self-test: ' + (e && e.message ? e.message : String(e)));
    }
    result.drew = result.nonBackgroundBefore > 0 && result.nonBackgroundAfter > 0;
    result.changed = result.ran && result.checksumBefore !== result.checksumAfter;
    result.errors = probe.errors;
    document.getElementById('selftest').textContent = JSON.stringify(result);
  });
})();
""";

    /// <summary>The folding viewer: software orthographic projection, painter's algorithm, Lambert
    /// shading, drag to turn, a slider along the folding path (linear between keyframes).</summary>
    public const string Viewer = """
(function () {
  'use strict';
  var data = JSON.parse(document.getElementById('tessel-viewer-data').textContent);
  var canvas = document.getElementById('tessel-viewer');
  var ctx = canvas.getContext('2d');
  var slider = document.getElementById('tessel-progress');
  var readout = document.getElementById('tessel-progress-value');
  var modeSelect = document.getElementById('tessel-colour-mode');
  var playButton = document.getElementById('tessel-play');
  var W = canvas.width, H = canvas.height;
  var BACKGROUND = [247, 246, 241];
  var TOP_SIDE = [233, 220, 194], UNDER_SIDE = [150, 172, 190];
  var DEG = Math.PI / 180;

  var frames = data.keyframes.length ? data.keyframes : [{ p: 1, x: data.folded }];
  var edgeRole = {};
  for (var e = 0; e + 2 < data.edges.length; e += 3) {
    var a = data.edges[e], b = data.edges[e + 1];
    edgeRole[a < b ? a + ',' + b : b + ',' + a] = data.edges[e + 2];
  }
  var stops = data.palette.map(function (hex) {
    return [parseInt(hex.substr(1, 2), 16), parseInt(hex.substr(3, 2), 16), parseInt(hex.substr(5, 2), 16)];
  });
  var yaw = -60 * DEG, pitch = 35 * DEG, zoom = 1;

  function centre(x) {
    var lo = [Infinity, Infinity, Infinity], hi = [-Infinity, -Infinity, -Infinity];
    for (var i = 0; i < x.length; i += 3)
      for (var k = 0; k < 3; k++) { lo[k] = Math.min(lo[k], x[i + k]); hi[k] = Math.max(hi[k], x[i + k]); }
    return [(lo[0] + hi[0]) / 2, (lo[1] + hi[1]) / 2, (lo[2] + hi[2]) / 2];
  }
  // One zoom for the whole path, so the model does not swell or shrink while it folds: the largest
  // that fits every state into the canvas from the opening view (wheel zoom adjusts it later).
  function viewAxes() {
    var toward = [Math.cos(pitch) * Math.cos(yaw), Math.cos(pitch) * Math.sin(yaw), Math.sin(pitch)];
    var right = [-Math.sin(yaw), Math.cos(yaw), 0];
    var up = [toward[1] * right[2] - toward[2] * right[1], toward[2] * right[0] - toward[0] * right[2], toward[0] * right[1] - toward[1] * right[0]];
    return { toward: toward, right: right, up: up };
  }
  var baseScale = Infinity;
  (function () {
    var v = viewAxes();
    frames.forEach(function (f) {
      var c = centre(f.x), mx = 1e-12, my = 1e-12;
      for (var i = 0; i < f.x.length; i += 3) {
        var dx = f.x[i] - c[0], dy = f.x[i + 1] - c[1], dz = f.x[i + 2] - c[2];
        mx = Math.max(mx, Math.abs(dx * v.right[0] + dy * v.right[1] + dz * v.right[2]));
        my = Math.max(my, Math.abs(dx * v.up[0] + dy * v.up[1] + dz * v.up[2]));
      }
      baseScale = Math.min(baseScale, 0.42 * W / mx, 0.44 * H / my);
    });
  })();

  function positionsAt(t) {
    if (frames.length === 1 || t <= frames[0].p) return frames[0].x;
    var last = frames[frames.length - 1];
    if (t >= last.p) return last.x;
    var k = 0;
    while (k + 1 < frames.length - 1 && frames[k + 1].p < t) k++;
    var f0 = frames[k], f1 = frames[k + 1];
    var s = (t - f0.p) / (f1.p - f0.p), out = new Array(f0.x.length);
    for (var i = 0; i < out.length; i++) out[i] = f0.x[i] + (f1.x[i] - f0.x[i]) * s;
    return out;
  }

  function deviationColour(d) {
    var span = Math.max(Math.abs(data.barMin), Math.abs(data.barMax), data.smallestSpan);
    var t = Math.max(-1, Math.min(1, d / span));
    var u = (t + 1) * 2, k = Math.min(3, Math.floor(u)), f = u - k;
    return [0, 1, 2].map(function (c) { return stops[k][c] + (stops[k + 1][c] - stops[k][c]) * f; });
  }

  function rgb(c, shade) {
    return 'rgb(' + Math.round(c[0] * shade) + ',' + Math.round(c[1] * shade) + ',' + Math.round(c[2] * shade) + ')';
  }

  function draw() {
    var t = slider.value / 1000;
    readout.textContent = Math.round(t * 100) + ' %';
    var x = positionsAt(t), c = centre(x);
    var axes = viewAxes(), toward = axes.toward, right = axes.right, up = axes.up;
    var light = [0, 1, 2].map(function (k) { return 0.45 * toward[k] + 0.6 * up[k] - 0.45 * right[k]; });
    var ll = Math.sqrt(light[0] * light[0] + light[1] * light[1] + light[2] * light[2]);
    light = light.map(function (v) { return v / ll; });
    var scale = zoom * baseScale;
    var n = x.length / 3, sx = new Float64Array(n), sy = new Float64Array(n), depth = new Float64Array(n);
    for (var i = 0; i < n; i++) {
      var px = x[3 * i] - c[0], py = x[3 * i + 1] - c[1], pz = x[3 * i + 2] - c[2];
      sx[i] = W / 2 + (px * right[0] + py * right[1] + pz * right[2]) * scale;
      sy[i] = H / 2 - (px * up[0] + py * up[1] + pz * up[2]) * scale;
      depth[i] = px * toward[0] + py * toward[1] + pz * toward[2];
    }
    var order = data.faces.map(function (f, index) {
      var d = 0;
      for (var k = 0; k < f.length; k++) d += depth[f[k]];
      return { index: index, depth: d / f.length };
    });
    order.sort(function (p, q) { return p.depth - q.depth || p.index - q.index; });

    ctx.setLineDash([]);
    ctx.fillStyle = 'rgb(' + BACKGROUND.join(',') + ')';
    ctx.fillRect(0, 0, W, H);
    var mode = modeSelect.value;
    ctx.lineJoin = 'round';
    order.forEach(function (item) {
      var f = data.faces[item.index];
      if (f.length < 3) return;
      var nx = 0, ny = 0, nz = 0;
      for (var k = 0; k < f.length; k++) {
        var p = 3 * f[k], q = 3 * f[(k + 1) % f.length];
        nx += (x[p + 1] - x[q + 1]) * (x[p + 2] + x[q + 2]);
        ny += (x[p + 2] - x[q + 2]) * (x[p] + x[q]);
        nz += (x[p] - x[q]) * (x[p + 1] + x[q + 1]);
      }
      var nl = Math.sqrt(nx * nx + ny * ny + nz * nz) || 1;
      nx /= nl; ny /= nl; nz /= nl;
      var shade = 0.42 + 0.58 * Math.abs(nx * light[0] + ny * light[1] + nz * light[2]);
      var colour;
      if (mode === 'side') {
        colour = nx * toward[0] + ny * toward[1] + nz * toward[2] >= 0 ? TOP_SIDE : UNDER_SIDE;
      } else {
        var d = 0;
        for (var k2 = 0; k2 < f.length; k2++) d += data.deviation[f[k2]];
        colour = deviationColour(d / f.length);
      }
      ctx.beginPath();
      ctx.moveTo(sx[f[0]], sy[f[0]]);
      for (var k3 = 1; k3 < f.length; k3++) ctx.lineTo(sx[f[k3]], sy[f[k3]]);
      ctx.closePath();
      ctx.fillStyle = rgb(colour, shade);
      ctx.fill();
      for (var k4 = 0; k4 < f.length; k4++) {
        var v0 = f[k4], v1 = f[(k4 + 1) % f.length];
        var role = edgeRole[v0 < v1 ? v0 + ',' + v1 : v1 + ',' + v0];
        if (role === undefined) role = 0;
        ctx.strokeStyle = data.roleColours[role];
        ctx.lineWidth = role === 0 ? 1.6 : role === 3 ? 0.5 : 1.2;
        ctx.setLineDash(role === 2 ? [6, 3] : []);
        ctx.beginPath();
        ctx.moveTo(sx[v0], sy[v0]);
        ctx.lineTo(sx[v1], sy[v1]);
        ctx.stroke();
      }
    });
    ctx.setLineDash([]);
    if (mode !== 'side') drawLegend();
  }

  function drawLegend() {
    var left = W - 34, top = 28, height = 140;
    for (var y = 0; y < height; y++) {
      var d = data.barMax + (data.barMin - data.barMax) * (y / (height - 1));
      ctx.fillStyle = rgb(deviationColour(d), 1);
      ctx.fillRect(left, top + y, 16, 1);
    }
    ctx.strokeStyle = '#2a2a30';
    ctx.lineWidth = 1;
    ctx.strokeRect(left - 0.5, top - 0.5, 17, height + 1);
    ctx.fillStyle = '#2a2a30';
    ctx.font = '12px sans-serif';
    ctx.textAlign = 'right';
    // A pale halo keeps the labels readable where the model is drawn behind them.
    haloText(mm(data.barMax) + ' mm', left - 6, top + 8);
    haloText(mm(data.barMin) + ' mm', left - 6, top + height);
    haloText('full scale', left + 16, top + height + 18);
  }

  function haloText(text, x, y) {
    ctx.save();
    ctx.lineWidth = 4;
    ctx.lineJoin = 'round';
    ctx.strokeStyle = 'rgba(246, 245, 241, 0.92)';
    ctx.strokeText(text, x, y);
    ctx.restore();
    ctx.fillText(text, x, y);
  }

  function mm(metres) {
    var v = metres * 1000, a = Math.abs(v);
    var s = a >= 100 ? a.toFixed(0) : a >= 10 ? a.toFixed(1) : a >= 1 ? a.toFixed(2) : a.toFixed(3);
    return (v > 0 ? '+' : v < 0 ? '-' : '') + s;
  }

  var dragging = null;
  canvas.addEventListener('pointerdown', function (ev) {
    dragging = { x: ev.clientX, y: ev.clientY };
    canvas.setPointerCapture(ev.pointerId);
  });
  canvas.addEventListener('pointermove', function (ev) {
    if (!dragging) return;
    yaw -= (ev.clientX - dragging.x) * 0.01;
    pitch = Math.max(-89 * DEG, Math.min(89 * DEG, pitch + (ev.clientY - dragging.y) * 0.01));
    dragging = { x: ev.clientX, y: ev.clientY };
    draw();
  });
  function endDrag() { dragging = null; }
  canvas.addEventListener('pointerup', endDrag);
  canvas.addEventListener('pointercancel', endDrag);
  canvas.addEventListener('wheel', function (ev) {
    ev.preventDefault();
    zoom = Math.max(0.3, Math.min(8, zoom * Math.exp(-ev.deltaY * 0.001)));
    draw();
  }, { passive: false });
  slider.addEventListener('input', draw);
  modeSelect.addEventListener('change', draw);

  var playing = false, direction = -1;
  function step() {
    if (!playing) return;
    var v = Number(slider.value) + direction * 6;
    if (v <= 0 || v >= 1000) direction = -direction;
    slider.value = Math.max(0, Math.min(1000, v));
    draw();
    requestAnimationFrame(step);
  }
  playButton.addEventListener('click', function () {
    playing = !playing;
    playButton.textContent = playing ? 'pause' : 'play';
    if (playing) requestAnimationFrame(step);
  });

  function pixelStats() {
    var px = ctx.getImageData(0, 0, W, H).data, hash = 2166136261, painted = 0;
    for (var i = 0; i < px.length; i += 4) {
      if (px[i] !== BACKGROUND[0] || px[i + 1] !== BACKGROUND[1] || px[i + 2] !== BACKGROUND[2]) painted++;
      for (var k = 0; k < 4; k++) { hash ^= px[i + k]; hash = Math.imul(hash, 16777619) >>> 0; }
    }
    return { checksum: hash, painted: painted };
  }

  window.tesselRunSelfTest = function () {
    slider.value = 1000;
    draw();
    var before = pixelStats();
    slider.value = 350;
    slider.dispatchEvent(new Event('input'));
    var after = pixelStats();
    return {
      checksumBefore: before.checksum, checksumAfter: after.checksum,
      nonBackgroundBefore: before.painted, nonBackgroundAfter: after.painted,
      pixels: W * H, progressAfter: slider.value / 1000
    };
  };

  slider.disabled = frames.length < 2;
  draw();
})();
""";
}
