// A top-down SVG of the setup: camera in front, subject at the centre, key light at its angle
// and distance, rim light behind with its beam, and the background direction. Positions come
// from the plan (key) and the inputs (rim); the camera position is schematic.
import { esc, fmt } from './escape.js';

export interface DiagramInput {
  unit: 'm' | 'ft';
  key: {
    towardCamera: number;
    sideways: number;
    distance: number;
    angleDeg: number;
    modifier: string;
  };
  rim: { distanceBehind: number; beamAngleDeg: number; height: number } | null;
  /** Subject-to-background distance, same unit, when known. */
  backgroundBehind: number | null;
}

const W = 520;
const H = 380;
const CX = W / 2;
const CY = 190;
const DEG = Math.PI / 180;

export function topDownDiagram(d: DiagramInput): string {
  const keyX = -Math.abs(d.key.sideways); // drawn on camera-left; mirror it freely on location
  const keyY = d.key.towardCamera; // + = toward the camera (down the page)
  const rimY = d.rim ? -d.rim.distanceBehind : 0;
  const camY = Math.max(2, d.key.distance * 1.5, keyY + 1.5);
  const extentX = Math.max(2, Math.abs(keyX) + 1);
  const extentUp = Math.max(1.5, -rimY + 1);
  const scale = Math.min((W / 2 - 60) / extentX, (CY - 40) / extentUp, (H - CY - 50) / camY);
  const sx = (x: number) => CX + x * scale;
  const sy = (y: number) => CY + y * scale;
  const parts: string[] = [];

  // Background direction (clipped to the drawing when far away).
  if (d.backgroundBehind !== null && d.backgroundBehind > 0) {
    const by = Math.max(-d.backgroundBehind, -(CY - 22) / scale);
    const clipped = -d.backgroundBehind < by;
    parts.push(
      `<line class="bg" x1="40" y1="${sy(by)}" x2="${W - 40}" y2="${sy(by)}"/>`,
      `<text x="${W - 44}" y="${sy(by) - 6}" text-anchor="end">background ${clipped ? '↑ ' : ''}≈ ${fmt(d.backgroundBehind)} ${d.unit} behind</text>`,
    );
  }
  // Camera (schematic distance) looking at the subject.
  parts.push(
    `<line class="axis" x1="${CX}" y1="${sy(camY)}" x2="${CX}" y2="${CY}"/>`,
    `<rect class="camera" x="${CX - 16}" y="${sy(camY)}" width="32" height="20" rx="3"/>`,
    `<rect class="camera" x="${CX - 7}" y="${sy(camY) - 8}" width="14" height="9" rx="2"/>`,
    `<text x="${CX + 24}" y="${sy(camY) + 14}">camera</text>`,
  );
  // Key light: a panel facing the subject, with its throw line.
  const kx = sx(keyX);
  const ky = sy(keyY);
  const facing = Math.atan2(CY - ky, CX - kx) / DEG;
  parts.push(
    `<line class="throw" x1="${kx}" y1="${ky}" x2="${CX}" y2="${CY}"/>`,
    `<g transform="translate(${kx} ${ky}) rotate(${facing + 90})"><rect class="key" x="-22" y="-5" width="44" height="10" rx="2"/></g>`,
    `<text x="${kx}" y="${ky + 26}" text-anchor="middle">key · ${esc(d.key.modifier)}</text>`,
    `<text x="${kx}" y="${ky + 40}" text-anchor="middle">${fmt(d.key.distance, 2)} ${d.unit} · ${fmt(d.key.angleDeg, 0)}° off axis</text>`,
  );
  // Rim light behind the subject with its beam cone.
  if (d.rim) {
    const ry = sy(rimY);
    const half = (Math.min(d.rim.beamAngleDeg, 170) / 2) * DEG;
    const reach = Math.abs(ry - CY) * 1.25 + 20;
    const dx = Math.tan(half) * reach;
    parts.push(
      `<path class="beam" d="M ${CX} ${ry} L ${CX - dx} ${ry + reach} L ${CX + dx} ${ry + reach} Z"/>`,
      `<circle class="rim" cx="${CX}" cy="${ry}" r="8"/>`,
      `<text x="${CX + 16}" y="${ry - 4}">rim · ${fmt(d.rim.distanceBehind, 2)} ${d.unit} behind, ${fmt(d.rim.height, 2)} ${d.unit} up</text>`,
      `<text x="${CX + 16}" y="${ry + 10}">beam ${fmt(d.rim.beamAngleDeg, 0)}°</text>`,
    );
  }
  // Subject.
  parts.push(
    `<circle class="subject" cx="${CX}" cy="${CY}" r="11"/>`,
    `<text x="${CX + 18}" y="${CY + 4}">subject</text>`,
  );
  // Scale bar: one unit.
  parts.push(
    `<line class="scale" x1="24" y1="${H - 18}" x2="${24 + scale}" y2="${H - 18}"/>`,
    `<text x="24" y="${H - 24}">1 ${d.unit}</text>`,
  );
  const label = `Top-down diagram: key light ${fmt(d.key.distance, 2)} ${d.unit} from the subject at ${fmt(d.key.angleDeg, 0)} degrees${d.rim ? `, rim light ${fmt(d.rim.distanceBehind, 2)} ${d.unit} behind` : ''}.`;
  return `<svg class="diagram" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" aria-label="${esc(label)}" xmlns="http://www.w3.org/2000/svg"><title>${esc(label)}</title>${parts.join('')}</svg>`;
}
