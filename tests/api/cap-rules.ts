import { XMLParser } from 'fast-xml-parser';

/**
 * A schema-level check of a CAP 1.2 message, written from the OASIS CAP 1.2 specification
 * (section 3.2 data dictionary and the XML schema of section 3.4): element order and
 * cardinality, required elements, code-value enumerations, the dateTime form (numeric offset,
 * never "Z"), `<references>` entries and polygons. Returns the problems found (empty = valid).
 */

type Node = Record<string, unknown>;
interface Element {
  name: string;
  children: Element[];
  text: string;
  attributes: Record<string, string>;
}

function toElements(nodes: Node[]): Element[] {
  const out: Element[] = [];
  for (const node of nodes) {
    const name = Object.keys(node).find((k) => k !== ':@');
    if (!name || name === '#text' || name.startsWith('?')) continue;
    const raw = node[name];
    const kids = Array.isArray(raw) ? (raw as Node[]) : [];
    const text = kids.map((k) => (typeof k['#text'] === 'string' || typeof k['#text'] === 'number' ? String(k['#text']) : '')).join('');
    const attributes = (node[':@'] ?? {}) as Record<string, string>;
    out.push({ name, children: toElements(kids), text, attributes });
  }
  return out;
}

interface Slot {
  name: string;
  min: number;
  max: number;
}
const one = (name: string): Slot => ({ name, min: 1, max: 1 });
const opt = (name: string): Slot => ({ name, min: 0, max: 1 });
const many = (name: string, min = 0): Slot => ({ name, min, max: Infinity });

// CAP 1.2 XML schema (section 3.4): the sequences of alert, info, parameter and area.
const alertSequence = [one('identifier'), one('sender'), one('sent'), one('status'), one('msgType'), opt('source'), one('scope'), opt('restriction'), opt('addresses'), many('code'), opt('note'), opt('references'), opt('incidents'), many('info')];
const infoSequence = [opt('language'), many('category', 1), one('event'), many('responseType'), one('urgency'), one('severity'), one('certainty'), opt('audience'), many('eventCode'), opt('effective'), opt('onset'), opt('expires'), opt('senderName'), opt('headline'), opt('description'), opt('instruction'), opt('web'), opt('contact'), many('parameter'), many('resource'), many('area')];
const parameterSequence = [one('valueName'), one('value')];
const areaSequence = [one('areaDesc'), many('polygon'), many('circle'), many('geocode'), opt('altitude'), opt('ceiling')];

// CAP 1.2 section 3.2 code values.
const enumerations: Record<string, readonly string[]> = {
  status: ['Actual', 'Exercise', 'System', 'Test', 'Draft'],
  msgType: ['Alert', 'Update', 'Cancel', 'Ack', 'Error'],
  scope: ['Public', 'Restricted', 'Private'],
  category: ['Geo', 'Met', 'Safety', 'Security', 'Rescue', 'Fire', 'Health', 'Env', 'Transport', 'Infra', 'CBRNE', 'Other'],
  responseType: ['Shelter', 'Evacuate', 'Prepare', 'Execute', 'Avoid', 'Monitor', 'Assess', 'AllClear', 'None'],
  urgency: ['Immediate', 'Expected', 'Future', 'Past', 'Unknown'],
  severity: ['Extreme', 'Severe', 'Moderate', 'Minor', 'Unknown'],
  certainty: ['Observed', 'Likely', 'Possible', 'Unlikely', 'Unknown'],
};

// CAP 1.2 schema pattern for dateTime: a numeric offset is required; "Z" is not allowed (UTC is "-00:00").
const capDateTimePattern = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}[-+]\d{2}:\d{2}$/;
// identifier and sender: no spaces, commas or restricted characters (< and &).
const identifierPattern = /^[^\s,<&]+$/;

function checkSequence(where: string, children: Element[], sequence: Slot[], problems: string[]) {
  let i = 0;
  for (const slot of sequence) {
    let count = 0;
    while (i < children.length && children[i]?.name === slot.name) {
      count++;
      i++;
    }
    if (count < slot.min) problems.push(`${where}: <${slot.name}> is required`);
    if (count > slot.max) problems.push(`${where}: <${slot.name}> may appear at most ${slot.max} time(s)`);
  }
  if (i < children.length) problems.push(`${where}: <${children[i]?.name}> is out of order or not a CAP 1.2 element`);
}

function checkText(where: string, element: Element, problems: string[]) {
  const allowed = enumerations[element.name];
  if (allowed && !allowed.includes(element.text)) problems.push(`${where}: <${element.name}> "${element.text}" is not one of ${allowed.join(', ')}`);
  if (['sent', 'effective', 'onset', 'expires'].includes(element.name) && !capDateTimePattern.test(element.text)) problems.push(`${where}: <${element.name}> "${element.text}" is not a CAP dateTime with a numeric offset`);
}

export function checkPolygon(text: string): string | null {
  const pairs = text.trim().split(/\s+/);
  if (pairs.length < 4) return `a polygon needs at least 4 coordinate pairs, got ${pairs.length}`;
  if (pairs[0] !== pairs[pairs.length - 1]) return 'the first and last pairs of a polygon must be the same';
  for (const pair of pairs) {
    const match = /^(-?\d+(?:\.\d+)?),(-?\d+(?:\.\d+)?)$/.exec(pair);
    if (!match) return `"${pair}" is not a "lat,lon" pair`;
    const lat = Number(match[1]);
    const lon = Number(match[2]);
    if (Math.abs(lat) > 90 || Math.abs(lon) > 180) return `"${pair}" is outside WGS 84 latitude/longitude ranges`;
  }
  return null;
}

export function checkCapMessage(xml: string): string[] {
  const problems: string[] = [];
  const parser = new XMLParser({ preserveOrder: true, ignoreAttributes: false, attributeNamePrefix: '', parseTagValue: false, trimValues: true });
  const roots = toElements(parser.parse(xml) as Node[]);
  const alert = roots[0];
  if (roots.length !== 1 || alert?.name !== 'alert') return ['the document element must be <alert>'];
  if (alert.attributes.xmlns !== 'urn:oasis:names:tc:emergency:cap:1.2') problems.push('<alert> must be in the urn:oasis:names:tc:emergency:cap:1.2 namespace');
  checkSequence('alert', alert.children, alertSequence, problems);
  for (const child of alert.children) checkText('alert', child, problems);
  for (const name of ['identifier', 'sender']) {
    const value = alert.children.find((c) => c.name === name)?.text ?? '';
    if (!identifierPattern.test(value)) problems.push(`alert: <${name}> must not contain spaces, commas, < or &`);
  }
  const msgType = alert.children.find((c) => c.name === 'msgType')?.text;
  const references = alert.children.find((c) => c.name === 'references')?.text;
  if ((msgType === 'Update' || msgType === 'Cancel') && !references) problems.push(`alert: a ${msgType} must list the messages it replaces in <references>`);
  for (const entry of references ? references.trim().split(/\s+/) : []) {
    const parts = entry.split(',');
    if (parts.length !== 3 || !identifierPattern.test(parts[0] ?? '') || !identifierPattern.test(parts[1] ?? '') || !capDateTimePattern.test(parts[2] ?? '')) problems.push(`alert: reference "${entry}" is not sender,identifier,sent`);
  }
  alert.children
    .filter((c) => c.name === 'info')
    .forEach((info, n) => {
      const where = `info[${n}]`;
      checkSequence(where, info.children, infoSequence, problems);
      for (const child of info.children) checkText(where, child, problems);
      for (const parameter of info.children.filter((c) => c.name === 'parameter')) checkSequence(`${where}.parameter`, parameter.children, parameterSequence, problems);
      info.children
        .filter((c) => c.name === 'area')
        .forEach((area, m) => {
          checkSequence(`${where}.area[${m}]`, area.children, areaSequence, problems);
          for (const polygon of area.children.filter((c) => c.name === 'polygon')) {
            const problem = checkPolygon(polygon.text);
            if (problem) problems.push(`${where}.area[${m}]: ${problem}`);
          }
        });
    });
  return problems;
}

/** The parsed message as plain nested objects (for reading values in tests). */
export function parseCap(xml: string): Element {
  const parser = new XMLParser({ preserveOrder: true, ignoreAttributes: false, attributeNamePrefix: '', parseTagValue: false, trimValues: true });
  const [alert] = toElements(parser.parse(xml) as Node[]);
  if (!alert) throw new Error('no alert element');
  return alert;
}
export type CapElement = Element;
