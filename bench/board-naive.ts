// The yardstick for bench/board.ts: the obvious way to put markers over a sheet. pdf.js draws
// the sheet once and it is moved by a CSS transform; every marker is a Konva group (disc and
// label) that is moved and redrawn, all 2,000 of them, on every frame the view changes.
export const naivePage = (pdfjs: { library: string; worker: string }) => `<!doctype html>
<html><head><meta charset="utf-8">
<style>body{margin:0}#viewport{position:relative;width:1240px;height:700px;overflow:hidden;background:#e9ecf0;touch-action:none}
#sheet{position:absolute;left:0;top:0;transform-origin:0 0}#stage{position:absolute;inset:0}</style>
<script src="./konva.js"></script></head>
<body><div id="viewport"><canvas id="sheet"></canvas><div id="stage"></div></div>
<script type="module">
import * as pdfjs from '${pdfjs.library}';
pdfjs.GlobalWorkerOptions.workerSrc = '${pdfjs.worker}';
const element = document.getElementById('viewport');
const width = element.clientWidth, height = element.clientHeight;
const file = new URLSearchParams(location.search).get('file');
const pdf = await pdfjs.getDocument({ url: file, isEvalSupported: false, disableAutoFetch: true, disableStream: true }).promise;
const page = await pdf.getPage(1);
const size = page.getViewport({ scale: 1 });
const fit = Math.min((width - 24) / size.width, (height - 24) / size.height);
const sheet = document.getElementById('sheet');
const viewport = page.getViewport({ scale: fit });
sheet.width = Math.floor(viewport.width);
sheet.height = Math.floor(viewport.height);
await page.render({ canvas: sheet, viewport }).promise;
let scale = fit, cx = 0.5, cy = 0.5;
const stage = new Konva.Stage({ container: 'stage', width, height });
const layer = new Konva.Layer();
stage.add(layer);
let groups = [];
const toScreen = (x, y) => ({ x: (x - cx) * size.width * scale + width / 2, y: (y - cy) * size.height * scale + height / 2 });
let pending = false;
function redraw() {
	pending = false;
	const left = toScreen(0, 0);
	sheet.style.transform = 'translate(' + left.x + 'px,' + left.y + 'px) scale(' + scale / fit + ')';
	for (const { group, marker } of groups) group.position(toScreen(marker.location.x, marker.location.y));
	layer.draw();
}
const request = () => { if (!pending) { pending = true; requestAnimationFrame(redraw); } };
window.addMarkers = (markers) => {
	groups = markers.map((marker) => {
		const group = new Konva.Group();
		group.add(new Konva.Circle({ radius: 11, fill: '#1d5fa8', stroke: '#fff', strokeWidth: 1.5 }));
		group.add(new Konva.Text({ text: marker.label, fontSize: 9, fill: '#fff', x: -10, y: -5, width: 20, align: 'center' }));
		layer.add(group);
		return { group, marker };
	});
	request();
};
let drag = null;
element.addEventListener('pointerdown', (e) => { drag = { x: e.clientX, y: e.clientY }; });
element.addEventListener('pointermove', (e) => {
	if (!drag) return;
	cx -= (e.clientX - drag.x) / (size.width * scale);
	cy -= (e.clientY - drag.y) / (size.height * scale);
	drag = { x: e.clientX, y: e.clientY };
	request();
});
element.addEventListener('pointerup', () => { drag = null; });
element.addEventListener('wheel', (e) => {
	e.preventDefault();
	const box = element.getBoundingClientRect();
	const px = e.clientX - box.left, py = e.clientY - box.top;
	const hx = cx + (px - width / 2) / (size.width * scale), hy = cy + (py - height / 2) / (size.height * scale);
	scale *= Math.exp(-e.deltaY * 0.0018);
	cx = hx - (px - width / 2) / (size.width * scale);
	cy = hy - (py - height / 2) / (size.height * scale);
	request();
}, { passive: false });
request();
window.naiveReady = true;
</script></body></html>`;
