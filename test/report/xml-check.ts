// A small XML well-formedness checker for the SVG tests: balanced tags, quoted and unique
// attributes, only the five predefined or numeric entities, no stray '<' or '&'.
// Rules from the XML 1.0 specification (W3C), sections 2.1 (well-formed documents),
// 2.4 (character data) and 4.1 (character and entity references).

const NAME = /^[A-Za-z_:][-A-Za-z0-9_.:]*$/;
const ENTITY = /^&(?:amp|lt|gt|quot|apos|#[0-9]+|#x[0-9A-Fa-f]+);/;

function checkText(s: string, where: number): void {
  for (let i = s.indexOf("&"); i >= 0; i = s.indexOf("&", i + 1)) {
    if (!ENTITY.test(s.slice(i))) throw new Error(`bad entity reference at ${where + i}: ${s.slice(i, i + 12)}`);
  }
}

/** Throws an Error describing the first problem; returns the element count. */
export function checkWellFormed(xml: string): number {
  let i = 0;
  const stack: string[] = [];
  let elements = 0;
  let rootClosed = false;
  if (xml.startsWith("<?xml")) i = xml.indexOf("?>") + 2;
  while (i < xml.length) {
    const lt = xml.indexOf("<", i);
    const text = xml.slice(i, lt < 0 ? xml.length : lt);
    checkText(text, i);
    if (text.includes(">")) throw new Error(`'>' in text at ${i} (allowed, but our writer escapes it)`);
    if (stack.length === 0 && text.trim() !== "") throw new Error(`text outside the root element at ${i}`);
    if (lt < 0) break;
    const gt = xml.indexOf(">", lt);
    if (gt < 0) throw new Error(`unclosed tag at ${lt}`);
    const tag = xml.slice(lt + 1, gt);
    if (tag.includes("<")) throw new Error(`'<' inside a tag at ${lt}`);
    if (tag.startsWith("/")) {
      const name = tag.slice(1).trim();
      const open = stack.pop();
      if (open !== name) throw new Error(`</${name}> closes <${open ?? "nothing"}> at ${lt}`);
      if (stack.length === 0) rootClosed = true;
    } else {
      if (rootClosed) throw new Error(`second root element at ${lt}`);
      const selfClosing = tag.endsWith("/");
      const body = selfClosing ? tag.slice(0, -1) : tag;
      const m = /^([^\s]+)([\s\S]*)$/.exec(body);
      if (!m || !NAME.test(m[1])) throw new Error(`bad element name at ${lt}: ${body.slice(0, 20)}`);
      const attrs = m[2];
      const seen = new Set<string>();
      const attrRe = /\s+([^\s=]+)="([^"]*)"/y;
      let k = 0;
      while (k < attrs.trimEnd().length) {
        attrRe.lastIndex = k;
        const a = attrRe.exec(attrs);
        if (!a) throw new Error(`bad attribute syntax in <${m[1]}> at ${lt}: ${attrs.slice(k, k + 30)}`);
        if (!NAME.test(a[1])) throw new Error(`bad attribute name ${a[1]}`);
        if (seen.has(a[1])) throw new Error(`attribute ${a[1]} twice in <${m[1]}>`);
        seen.add(a[1]);
        if (a[2].includes("<")) throw new Error(`'<' in attribute ${a[1]}`);
        checkText(a[2], lt);
        k = attrRe.lastIndex;
      }
      elements++;
      if (!selfClosing) stack.push(m[1]);
      else if (stack.length === 0) rootClosed = true;
    }
    i = gt + 1;
  }
  if (stack.length) throw new Error(`unclosed elements: ${stack.join(" > ")}`);
  if (elements === 0) throw new Error("no element");
  return elements;
}
