/**
 * The script of the report page, run in the browser after the inlined libraries: it draws every chart with
 * vega-embed (interpreted expressions, so no eval is needed) and the 3-D view with 3Dmol.js from the data
 * block. Plain ES2017, no modules.
 */
export const PAGE_SCRIPT = `
(function () {
  'use strict';
  var data = JSON.parse(document.getElementById('lumenfold-data').textContent);
  var failed = function (el, what, e) {
    console.error(what + ': ' + (e && e.message ? e.message : e));
    el.textContent = what + ' could not be drawn: ' + (e && e.message ? e.message : e);
    el.className += ' error';
  };
  data.charts.forEach(function (c) {
    var el = document.getElementById(c.id);
    vegaEmbed(el, c.spec, { renderer: 'svg', ast: true, actions: { export: true, source: false, compiled: false, editor: false } })
      .then(function () { el.setAttribute('data-drawn', 'true'); })
      .catch(function (e) { failed(el, 'the chart "' + c.id + '"', e); });
  });
  var v = data.viewer;
  var host = document.getElementById('viewer');
  if (v && v.pdb && host) {
    try {
      var viewer = $3Dmol.createViewer(host, { backgroundColor: 'white', antialias: true });
      viewer.addModel(v.pdb, 'pdb');
      viewer.setStyle({}, { stick: { radius: 0.3, color: '#8a94a3' } });
      v.sites.forEach(function (s) {
        viewer.setStyle({ resi: s.id }, { stick: { radius: 0.35, color: s.colour } });
        viewer.addStyle({ resi: s.id, atom: s.centre }, { sphere: { radius: s.trap ? 1.6 : 1.1, color: s.colour } });
        viewer.addLabel(s.label, { position: s.at, fontSize: 12, fontColor: '#1d1d1f', backgroundColor: '#ffffff', backgroundOpacity: 0.75, showBackground: true, inFront: true });
      });
      var fit = function () { viewer.zoomTo(); viewer.zoom(1.7); viewer.render(); };
      fit();
      host.setAttribute('data-drawn', 'true');
      document.getElementById('viewer-reset').addEventListener('click', fit);
    } catch (e) {
      failed(host, 'the 3-D view', e);
    }
  }
})();
`;
