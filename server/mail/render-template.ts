import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import Handlebars from 'handlebars';
import { publicCaution as caution } from '../../shared/workflow/caution';

const templatesDir = path.resolve(import.meta.dirname, '../../templates');

export interface RenderedMail {
  subject: string;
  html: string;
  text: string;
}


function createEngine(): typeof Handlebars {
  const engine = Handlebars.create();
  const partialsDir = path.join(templatesDir, 'partials');
  for (const file of readdirSync(partialsDir)) {
    const name = file.replace(/\.(html|txt)\.hbs$|\.(html|txt)$/, '');
    const kind = file.includes('.txt') ? 'txt' : 'html';
    engine.registerPartial(`${name}-${kind}`, readFileSync(path.join(partialsDir, file), 'utf8'));
  }
  return engine;
}

let engine: typeof Handlebars | undefined;
const cache = new Map<string, { subject: HandlebarsTemplateDelegate; html: HandlebarsTemplateDelegate; text: HandlebarsTemplateDelegate }>();

/**
 * Renders `templates/<purpose>.html` and `.txt` with Handlebars. The subject is the first line
 * of the text template (`Subject: …`). HTML output escapes every value; the text template uses
 * triple braces only for values that are already plain text.
 */
export function renderTemplate(purpose: string, data: Record<string, unknown>): RenderedMail {
  engine ??= createEngine();
  let compiled = cache.get(purpose);
  if (!compiled) {
    const textSource = readFileSync(path.join(templatesDir, `${purpose}.txt`), 'utf8');
    const [firstLine = '', ...rest] = textSource.split('\n');
    if (!firstLine.startsWith('Subject:')) throw new Error(`templates/${purpose}.txt must start with a "Subject:" line`);
    compiled = {
      subject: engine.compile(firstLine.slice('Subject:'.length).trim(), { noEscape: true }),
      html: engine.compile(readFileSync(path.join(templatesDir, `${purpose}.html`), 'utf8'), { strict: true }),
      text: engine.compile(rest.join('\n').replace(/^\n/, ''), { noEscape: true, strict: true }),
    };
    cache.set(purpose, compiled);
  }
  const context = { caution, ...data };
  return { subject: compiled.subject(context), html: compiled.html(context), text: compiled.text(context) };
}
