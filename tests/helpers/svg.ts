/** The <g> of a named vega mark or scope: vega writes class="mark-<type> role-<role> <name>". */
export function markGroup(svg: string, name: string): string {
  const start = svg.indexOf(` ${name}" role=`);
  if (start < 0) return '';
  const open = svg.lastIndexOf('<g', start);
  let depth = 0;
  const re = /<g\b|<\/g>/g;
  re.lastIndex = open;
  for (let m = re.exec(svg); m; m = re.exec(svg)) {
    depth += m[0] === '</g>' ? -1 : 1;
    if (depth === 0) return svg.slice(open, m.index + 4);
  }
  return svg.slice(open);
}
