/**
 * Office identity (issue 20, item 7): titleBlock.logo, the office defaults file (officeFile / --office-file),
 * their precedence (flags > chart set > office file), paths relative to the file that names them, SVG cleaning and
 * the exit-2 cases naming the field or flag. All fixtures invented (common practice for such files).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cleanSvg, logoFromBytes, svgSize } from '../../src/config/logo.js';
import { readChartSet } from '../../src/config/read.js';
import { officeJsonSchema } from '../../src/config/schema.js';
import { isPmError } from '../../src/errors.js';
import { resolveOfficeFlags } from '../../src/flags/office-flags.js';
import { nodeFileAccess } from '../../src/io/read.js';

const dir = mkdtempSync(join(tmpdir(), 'pmchart-office-'));
const sub = mkdtempSync(join(dir, 'office-'));
const LOGO = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 40 20"><rect width="40" height="20" fill="#234"/></svg>';
writeFileSync(join(sub, 'mark.svg'), LOGO);
writeFileSync(
  join(sub, 'office.json'),
  JSON.stringify({ office: 'Pellow & Strand Engineers (invented)', logo: 'mark.svg', preparedBy: 'R. Pellow', checkedBy: 'A. Strand', paper: { size: 'a3', orientation: 'portrait' }, units: 'si', basis: { code: 'en1992-1-1' } }),
);
const set = (over: Record<string, unknown> = {}, titleBlock: Record<string, unknown> = {}) =>
  JSON.stringify({
    name: 'office-test',
    officeFile: `${sub.slice(dir.length + 1)}/office.json`,
    titleBlock: { project: 'Tarn Yard Stores (invented)', date: '2026-01-05', ...titleBlock },
    sheets: [{ fc: '40MPa', fy: '500MPa', gamma: 0.8, arrangement: { kind: 'two-faces', barsPerFace: 3 } }],
    ...over,
  });
const read = (text: string) => readChartSet(text, { files: nodeFileAccess, baseDir: dir });
const failure = (f: () => unknown): { message: string; exitCode: number } => {
  try {
    f();
  } catch (e) {
    if (isPmError(e)) return { message: e.message, exitCode: e.exitCode };
    throw e;
  }
  throw new Error('did not fail');
};

describe('SVG logos are cleaned', () => {
  const dirty = `<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY x SYSTEM "file:///etc/passwd">]>
<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="80" height="40" onload="alert(1)">
  <script>fetch('https://tracker.invalid/x')</script>
  <script xlink:href="https://evil.invalid/a.js"/>
  <style>@import url(https://fonts.invalid/a.css); .a { fill: url(#g); background: url('https://tracker.invalid/b.png') }</style>
  <linearGradient id="g"><stop offset="0" stop-color="#123"/></linearGradient>
  <image href="https://tracker.invalid/pixel.png" width="1" height="1"/>
  <image xlink:href="data:image/png;base64,iVBORw0KGgo=" width="1" height="1"/>
  <use href="#g"/><use xlink:href="other.svg#part"/>
  <a href="&#106;avascript:alert(1)"><rect class="a" width="10" height="10" onclick="x()" style="fill:url(https://tracker.invalid/c)"/></a>
  <foreignObject><div xmlns="http://www.w3.org/1999/xhtml">hi</div></foreignObject>
  <animate attributeName="href" to="https://evil.invalid"/>
  <rect width="5" height="5" fill="url(https://tracker.invalid/d)"/>
</svg>`;
  const clean = cleanSvg(dirty);
  it('removes scripts, handlers, foreign content, animation and the DOCTYPE', () => {
    expect(clean).not.toMatch(/<script/i);
    expect(clean).not.toMatch(/\son\w+=/i);
    expect(clean).not.toMatch(/foreignObject|<animate|DOCTYPE|ENTITY/i);
  });
  it('removes every external reference: href, xlink:href, CSS url() and @import, javascript: in entities', () => {
    // namespace declarations name URIs but fetch nothing (Namespaces in XML 1.0, 2)
    expect(clean.replace(/\sxmlns(:\w+)?="[^"]*"/g, '')).not.toMatch(/https?:|javascript|other\.svg|@import/i);
    expect(clean).not.toContain('&#106;');
  });
  it('keeps fragment references and embedded PNG', () => {
    expect(clean).toContain('href="#g"');
    expect(clean).toContain('url(#g)');
    expect(clean).toContain('data:image/png;base64,iVBORw0KGgo=');
    expect(clean).toContain('<linearGradient id="g">');
  });
  it('sizes an SVG from its width/height or viewBox (96 px to the inch, CSS)', () => {
    expect(svgSize('<svg width="2in" height="1in">')).toEqual({ w: 192, h: 96 });
    expect(svgSize('<svg viewBox="0 0 40 20">')).toEqual({ w: 40, h: 20 });
    expect(svgSize('<svg width="80" viewBox="0 0 40 20">')).toEqual({ w: 80, h: 40 });
    expect(svgSize('<svg>')).toBeUndefined();
  });
  it('reads PNG by its signature and size from IHDR (ISO/IEC 15948 11.2.2), refuses what is neither (exit 2 naming the field)', () => {
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 73, 72, 68, 82, 0, 0, 1, 44, 0, 0, 0, 100]);
    expect(logoFromBytes(png, 'titleBlock.logo', 'a.png')).toMatchObject({ kind: 'png', width: 300, height: 100 });
    const e = failure(() => logoFromBytes(new TextEncoder().encode('GIF89a'), 'titleBlock.logo', 'a.gif'));
    expect(e.message).toMatch(/^titleBlock\.logo: .*neither a PNG nor an SVG/);
    expect(e.exitCode).toBe(2);
    expect(failure(() => logoFromBytes(new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg"/>'), '--logo', 'x.svg')).message).toMatch(/^--logo: .*without a size/);
  });
});

describe('office defaults file', () => {
  it('fills what the chart set leaves out, paths relative to the office file', () => {
    const s = read(set());
    expect(s.titleBlock.office).toBe('Pellow & Strand Engineers (invented)');
    expect(s.titleBlock.preparedBy).toBe('R. Pellow');
    expect(s.units).toBe('si');
    expect(s.code).toBe('en1992-1-1');
    expect(s.paper.size).toBe('a3');
    expect(s.paper.orientation).toBe('portrait');
    // the logo named by the office file, beside it (not beside the chart set)
    expect(s.titleBlock.logo?.kind).toBe('svg');
    expect(Buffer.from(s.titleBlock.logo!.dataUri.split(',')[1]!, 'base64').toString()).toContain('fill="#234"');
  });
  it('gives way to the chart set: field by field in titleBlock and paper, the basis as a whole', () => {
    writeFileSync(join(dir, 'own.svg'), LOGO.replace('#234', '#a51'));
    const s = read(set({ units: 'us', basis: { code: 'aci318-19' }, paper: { size: 'tabloid' } }, { office: 'Chart-set office (invented)', logo: 'own.svg' }));
    expect(s.titleBlock.office).toBe('Chart-set office (invented)');
    expect(s.titleBlock.checkedBy).toBe('A. Strand');
    expect(s.units).toBe('us');
    expect(s.code).toBe('aci318-19');
    expect(s.paper.size).toBe('tabloid');
    expect(s.paper.orientation).toBe('portrait'); // the chart set gave no orientation
    expect(Buffer.from(s.titleBlock.logo!.dataUri.split(',')[1]!, 'base64').toString()).toContain('#a51');
  });
  it('is in the zod schema and the JSON Schema', () => {
    const props = (officeJsonSchema().properties ?? {}) as Record<string, unknown>;
    expect(Object.keys(props)).toEqual(expect.arrayContaining(['office', 'logo', 'preparedBy', 'checkedBy', 'paper', 'units', 'basis']));
    expect(failure(() => read(JSON.stringify({ ...JSON.parse(set()), officeFile: 'nope.json' }))).message).toMatch(/^officeFile: .*cannot be read/);
    writeFileSync(join(dir, 'bad-office.json'), JSON.stringify({ office: 'X', colour: 'red' }));
    const e = failure(() => read(JSON.stringify({ ...JSON.parse(set()), officeFile: 'bad-office.json' })));
    expect(e.message).toMatch(/^officeFile: has unknown field "colour"/);
    expect(e.exitCode).toBe(2);
  });
  it('a missing or oversized logo is exit 2 naming titleBlock.logo (or the office file’s logo)', () => {
    const missing = failure(() => read(set({}, { logo: 'absent.svg' })));
    expect(missing.message).toMatch(/^titleBlock\.logo: .*cannot be read \(ENOENT\)/);
    expect(missing.exitCode).toBe(2);
    writeFileSync(join(dir, 'big.svg'), `${LOGO}<!--${'x'.repeat(1 << 20)}-->`);
    const big = failure(() => read(set({}, { logo: 'big.svg' })));
    expect(big.message).toMatch(/^titleBlock\.logo: .*is larger than 1048576 bytes/);
    expect(big.exitCode).toBe(2);
    writeFileSync(join(sub, 'office-missing-logo.json'), JSON.stringify({ logo: 'gone.png' }));
    const viaOffice = failure(() => read(JSON.stringify({ ...JSON.parse(set({ units: 'us', basis: { code: 'aci318-19' } }, { office: 'O' })), officeFile: `${sub.slice(dir.length + 1)}/office-missing-logo.json` })));
    expect(viaOffice.message).toMatch(/^officeFile logo: .*cannot be read/);
  });
  it('without file access a chart set naming a file is refused, not read quietly without it', () => {
    expect(() => readChartSet(set())).toThrow(/^officeFile: names a file/);
  });
});

describe('--office-file and --logo (flags > office file)', () => {
  it('takes the office file where a flag is unset, the flag where given', () => {
    const office = join(sub, 'office.json');
    const r = resolveOfficeFlags({ officeFile: office, checkedBy: 'K. Flag' });
    expect(r.office).toBe('Pellow & Strand Engineers (invented)');
    expect(r.preparedBy).toBe('R. Pellow');
    expect(r.checkedBy).toBe('K. Flag');
    expect(r.logo?.kind).toBe('svg');
    writeFileSync(join(dir, 'flag.svg'), LOGO.replace('#234', '#0a0'));
    const f = resolveOfficeFlags({ officeFile: office, office: 'Flag office (invented)', logo: join(dir, 'flag.svg') });
    expect(f.office).toBe('Flag office (invented)');
    expect(Buffer.from(f.logo!.dataUri.split(',')[1]!, 'base64').toString()).toContain('#0a0');
  });
  it('a missing --logo or --office-file is exit 2 naming the flag', () => {
    expect(failure(() => resolveOfficeFlags({ logo: join(dir, 'none.svg') }))).toMatchObject({ exitCode: 2, message: expect.stringMatching(/^--logo: .*cannot be read/) });
    expect(failure(() => resolveOfficeFlags({ officeFile: join(dir, 'none.json') })).message).toMatch(/^--office-file: .*cannot be read/);
    writeFileSync(join(dir, 'huge.png'), new Uint8Array((1 << 20) + 1));
    expect(failure(() => resolveOfficeFlags({ logo: join(dir, 'huge.png') })).message).toMatch(/^--logo: .*is larger than 1048576 bytes/);
  });
});
