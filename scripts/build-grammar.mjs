// Compiles every grammar/*.peggy into an ES module plus .d.ts typings under
// shared/chemistry/generated/ (git-ignored; rebuilt by `npm run grammar`).
// The parser is then moved to module scope (see moveParserToModuleScope).
// A grammar may declare its start rules' result types in a header comment:
//   // @return-types {"RuleName": "TypeScript type"}
// and every rule named there becomes an allowed start rule.
import { mkdir, readdir, readFile, writeFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import * as acorn from 'acorn';
import peggy from 'peggy';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const grammarDir = path.join(root, 'grammar');
const outDir = path.join(root, 'shared', 'chemistry', 'generated');
const require = createRequire(import.meta.url);
// peggy ships the typings template its own CLI uses for --dts.
const templatePath = path.join(path.dirname(require.resolve('peggy/package.json')), 'bin', 'generated_template.d.ts');

const template = await readFile(templatePath, 'utf8');

/** Writes only when the text changed, so an unchanged grammar leaves file times alone (run-e2e compares them). */
async function writeIfChanged(file, text) {
  const current = await readFile(file, 'utf8').catch(() => null);
  if (current !== text) await writeFile(file, text);
}

/**
 * Peggy puts the whole parser inside `peg$parse`: every call builds its constant tables and some
 * 130 closures (one per rule and per action) before reading a character, which dominates the cost
 * of parsing one short equation. This moves everything to module scope instead:
 * - the constant tables (`peg$c…`, `peg$r…`, `peg$e…`, `peg$FAILED`, the start-rule table) become
 *   module constants, built once; character classes test ASCII with a table (see CHAR_CLASS);
 * - the functions (rules, actions, helpers) become module functions;
 * - the per-parse variables (positions, the input, the options, the grammar's per-parse
 *   initializer) become module variables that `peg$parse` assigns at the start of every call and
 *   clears at the end.
 * Parsing stays synchronous and nothing it calls parses again, so one set of state is enough.
 */
// Peggy tests a character class with a regular expression on every character it tries. The
// class constants become this: a table for ASCII, built once, and the expression beyond it.
const CHAR_CLASS = `
function peg$charClass(re) {
  const ascii = new Uint8Array(128);
  for (let c = 0; c < 128; c++) ascii[c] = re.test(String.fromCharCode(c)) ? 1 : 0;
  return {
    test(ch) {
      const c = ch.charCodeAt(0);
      return c < 128 ? ascii[c] === 1 : re.test(ch);
    },
  };
}`;

function moveParserToModuleScope(code) {
  const ast = acorn.parse(code, { ecmaVersion: 'latest', sourceType: 'module' });
  const parse = ast.body.find((n) => n.type === 'FunctionDeclaration' && n.id.name === 'peg$parse');
  if (!parse || parse.params.length !== 2 || parse.params.some((p) => p.type !== 'Identifier')) {
    throw new Error('build-grammar: peg$parse(input, options) not found; check the peggy version');
  }
  const src = (node) => code.slice(node.start, node.end);
  const moduleNames = new Set();
  for (const n of ast.body) {
    if (n.type === 'FunctionDeclaration' || n.type === 'ClassDeclaration') moduleNames.add(n.id.name);
    if (n.type === 'VariableDeclaration') for (const d of n.declarations) moduleNames.add(d.id.name);
  }
  const claim = (name) => {
    if (moduleNames.has(name)) throw new Error(`build-grammar: '${name}' is declared twice; rename it in the grammar`);
    moduleNames.add(name);
  };
  const isConstant = (kind, name) =>
    kind === 'const' && (/^peg\$[cre]\d+$/.test(name) || name === 'peg$FAILED' || name === 'peg$startRuleFunctions');

  const [inputName, optionsName] = parse.params.map((p) => p.name);
  const state = [inputName, optionsName];
  claim(inputName);
  claim(optionsName);
  const moduleCode = [];
  const perCall = [];
  let constants = 0;
  for (const stmt of parse.body.body) {
    if (stmt.type === 'FunctionDeclaration') {
      claim(stmt.id.name);
      moduleCode.push(src(stmt));
    } else if (stmt.type === 'VariableDeclaration') {
      for (const d of stmt.declarations) {
        if (d.id.type !== 'Identifier') throw new Error('build-grammar: destructuring in peg$parse is not handled');
        const name = d.id.name;
        claim(name);
        if (isConstant(stmt.kind, name)) {
          const regex = d.init.type === 'Literal' && d.init.regex;
          const simpleClass = regex && /^\^\[.*\]$/.test(regex.pattern) && /^i?$/.test(regex.flags);
          moduleCode.push(`const ${name} = ${simpleClass ? `peg$charClass(${src(d.init)})` : src(d.init)};`);
          constants++;
        } else {
          state.push(name);
          perCall.push(`${name} = ${d.init ? src(d.init) : 'undefined'};`);
        }
      }
    } else {
      perCall.push(src(stmt));
    }
  }
  if (constants < 10) throw new Error('build-grammar: expected constant tables in peg$parse; check the peggy version');
  // Large per-call values are dropped after each call so the last input is not kept alive.
  const cleared = ['peg$result', 'peg$maxFailExpected', 'peg$posDetailsCache'].filter((n) => state.includes(n));
  const parser = [
    '// Moved to module scope by build-grammar.mjs: constants built once, state reset by each call.',
    CHAR_CLASS,
    `let ${state.join(', ')};`,
    ...moduleCode,
    `function peg$parse(${inputName}$, ${optionsName}$) {`,
    `  ${inputName} = ${inputName}$;`,
    `  ${optionsName} = ${optionsName}$;`,
    '  try {',
    ...perCall,
    '  } finally {',
    `    ${[inputName, optionsName, ...cleared].map((n) => `${n} = undefined;`).join(' ')}`,
    '  }',
    '}',
  ].join('\n');
  return code.slice(0, parse.start) + parser + code.slice(parse.end);
}
await mkdir(outDir, { recursive: true });

const files = (await readdir(grammarDir)).filter((f) => f.endsWith('.peggy')).sort();
if (files.length === 0) throw new Error(`no grammar files in ${grammarDir}`);

for (const file of files) {
  const name = file.replace(/\.peggy$/, '');
  const source = await readFile(path.join(grammarDir, file), 'utf8');
  const header = /^\/\/\s*@return-types\s+(\{.*\})\s*$/m.exec(source);
  const returnTypes = header ? JSON.parse(header[1]) : {};
  const startRules = Object.keys(returnTypes);

  let code;
  try {
    code = peggy.generate(source, {
      output: 'source',
      format: 'es',
      grammarSource: path.join('grammar', file),
      ...(startRules.length ? { allowedStartRules: startRules } : {}),
    });
  } catch (err) {
    if (typeof err.format === 'function')
      console.error(err.format([{ source: path.join('grammar', file), text: source }]));
    throw err;
  }

  const rules = startRules.length
    ? startRules
    : [/^\s*([A-Za-z_]\w*)\s*(?:"[^"]*")?\s*=/m.exec(source.replace(/\{\{[\s\S]*?\}\}/, ''))?.[1] ?? 'start'];
  const quoted = rules.map((r) => `"${r}"`);
  let dts = template.replace('$$$StartRules$$$', quoted.join(' | ')).replace('$$$DefaultStartRule$$$', quoted[0]);
  for (const rule of rules) {
    dts += `\ndeclare function ParseFunction<Options extends ParseOptions<"${rule}">>(\n  input: string,\n  options?: Options,\n): ${returnTypes[rule] ?? 'any'};\n`;
  }
  const all = [...new Set(rules.map((r) => returnTypes[r] ?? 'any'))].join(' | ');
  dts += `\ndeclare function ParseFunction<Options extends ParseOptions<StartRuleNames>>(\n  input: string,\n  options?: Options,\n): ${all};\n`;

  code = moveParserToModuleScope(code);
  const banner = `// Generated by scripts/build-grammar.mjs from grammar/${file}. Do not edit.\n`;
  await writeIfChanged(path.join(outDir, `${name}.js`), banner + '// @ts-nocheck\n' + code);
  await writeIfChanged(path.join(outDir, `${name}.d.ts`), banner + dts);
  console.log(`grammar: ${file} → shared/chemistry/generated/${name}.js (+ .d.ts), start rules: ${rules.join(', ')}`);
}
