import { existsSync, readFileSync } from 'node:fs';
import { readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fingerprintFromPdf } from '../../src-main/record/pdf/fingerprintFromPdf.js';
import { INTERIM_NOTICE } from '../../src-main/record/pdf/titleBlock.js';
import { layout } from '../../src-main/store/index.js';
import { decidedKestrelRun, incomingSpec, passes, recordWorkspace, sourceWithPlan, type RecordWorkspace } from '../record/fromRunFixtures.js';
import { flatten, pdfText } from '../record/pdfInspection.js';
import { runCli } from './runCli.js';

describe('tallyline record, verify --pdf and export on a real data folder', () => {
  let space: RecordWorkspace;
  let decidedId: string;
  let openId: string;

  beforeAll(async () => {
    space = await recordWorkspace();
    decidedId = (await decidedKestrelRun(space)).runId;
    const { source, plan } = await sourceWithPlan(space, 'Brightwater Plastics (invented)', 'Cap moulding, flash', incomingSpec);
    openId = (await space.service.startRun({ planId: plan.id, sourceId: source.id, lot: 'BW-0007', inspector: 'R. Quint' })).run.id;
    for (const result of passes('BW', 5, 'R. Quint')) await space.service.recordResult(openId, result);
    // The CLI is another process: release this one's journal handles and locks first.
    await space.service.close();
  }, 60_000);
  afterAll(() => space.cleanup());

  const dataFlags = () => ['--data-dir', space.data];

  it('writes the decision record of a decided run, exit 0, and verify --pdf agrees with the journal', async () => {
    const out = path.join(space.data, 'decided.pdf');
    const written = await runCli(['record', '--run', decidedId, '--out', out, ...dataFlags()]);
    expect(written.stderr).toBe('');
    expect(written.code).toBe(0);
    expect(written.stdout).toMatch(/^Decision record \(accept\) DR-\S+ of run run-\S+ written to .*decided\.pdf; fingerprint [0-9a-f]{64}\n$/);
    expect(readFileSync(out).subarray(0, 5).toString('latin1')).toBe('%PDF-');

    const verified = await runCli(['verify', '--run', decidedId, '--pdf', out, '--json', ...dataFlags()]);
    expect(verified.code).toBe(0);
    const report = JSON.parse(verified.stdout);
    expect(Object.keys(report)).toEqual(['ok', 'entries', 'fingerprint', 'problems', 'anchor', 'record']);
    expect(report).toMatchObject({ ok: true, problems: [], record: { printed: report.fingerprint, metadata: [report.fingerprint, report.fingerprint], matches: true, differs: [] } });
  }, 60_000);

  it('writes an interim record for a run not yet decided', async () => {
    const out = path.join(space.data, 'interim.pdf');
    const written = await runCli(['record', '--run', openId, '--out', out, ...dataFlags()]);
    expect(written.code).toBe(0);
    expect(written.stdout).toMatch(/^Interim record \(run not decided\) /);
    const pages = await pdfText(readFileSync(out));
    expect(flatten(pages[0])).toContain(INTERIM_NOTICE);
    for (const page of pages) expect(flatten(page)).toContain('INTERIM Decision record');
  }, 60_000);

  /** Prints a record, applies an edit to the journal file, runs verify --pdf (JSON and words), and restores the journal. */
  async function verifyAfterEdit(edit: (journal: string) => string) {
    const out = path.join(space.data, 'before-edit.pdf');
    expect((await runCli(['record', '--run', decidedId, '--out', out, ...dataFlags()])).code).toBe(0);
    const printed = (await fingerprintFromPdf(readFileSync(out))).printed;
    const journal = layout.runJournal(space.data, decidedId);
    const original = await readFile(journal, 'utf8');
    const edited = edit(original);
    expect(edited).not.toBe(original);
    await writeFile(journal, edited);
    try {
      const json = await runCli(['verify', '--run', decidedId, '--pdf', out, '--json', ...dataFlags()]);
      const words = await runCli(['verify', '--run', decidedId, '--pdf', out, ...dataFlags()]);
      const refused = await runCli(['record', '--run', decidedId, '--out', path.join(space.data, 'after-edit.pdf'), ...dataFlags()]);
      return { printed, json: { code: json.code, report: JSON.parse(json.stdout) }, words, refused };
    } finally {
      await writeFile(journal, original);
    }
  }

  it('fails verification against the printed record when an entry in the middle of the journal was edited, naming the entry', async () => {
    // Turn the nonconforming KF-0011 into a conforming item, as someone covering up a failure might.
    const { printed, json, words, refused } = await verifyAfterEdit((journal) =>
      journal.replace('"itemId":"KF-0011","result":"fail"', '"itemId":"KF-0011","result":"pass"'),
    );
    expect(json.code).toBe(1);
    expect(json.report.ok).toBe(false);
    // The chain breaks at the edited entry (seq 11); the final line, and so the fingerprint, is untouched.
    expect(json.report.problems[0]).toMatchObject({ seq: 11, kind: 'tampered' });
    expect(json.report.record).toMatchObject({ printed, matches: true, differs: [] });
    expect(words.code).toBe(1);
    expect(words.stdout).toContain('chain does NOT verify');
    expect(words.stdout).toMatch(/seq 11 \(line 12\): entry 11 does not match the hash recorded by entry 12/);
    expect(words.stdout).toContain("its fingerprint is the journal's final hash, but the chain above does not verify");
    // And no new record is made of a journal that does not verify.
    expect(refused.code).toBe(1);
    expect(refused.stderr).toMatch(/^tallyline record: run \S+: the journal does not verify .*entry 11.*no record is made of it\n$/);
    expect(existsSync(path.join(space.data, 'after-edit.pdf'))).toBe(false);
  }, 60_000);

  it('fails verification against the printed record when the last line was edited, naming both copies of the fingerprint', async () => {
    // The close entry is the last line: nothing after it carries its hash, so only the anchor and the fingerprint show the edit.
    const { printed, json, words } = await verifyAfterEdit((journal) => {
      const lines = journal.trimEnd().split('\n');
      lines[lines.length - 1] = lines[lines.length - 1].replace('"actor":"A. Brennan"', '"actor":"A. Brenan"');
      return `${lines.join('\n')}\n`;
    });
    expect(json.code).toBe(1);
    expect(json.report).toMatchObject({ ok: false, anchor: { status: 'differs', fingerprint: printed }, record: { printed, matches: false, differs: ['printed', 'metadata'] } });
    expect(json.report.problems).toEqual([expect.objectContaining({ seq: json.report.entries - 1, kind: 'tampered' })]);
    expect(json.report.fingerprint).not.toBe(printed);
    expect(words.stdout).toMatch(/does not have the hash its anchor records/);
    expect(words.stdout).toContain('its fingerprint does NOT match the journal (printed and metadata differ)');
    expect(words.stdout).toContain(`printed:  ${printed}`);
    expect(words.stdout).toContain(`journal:  ${json.report.fingerprint}`);
  }, 60_000);

  it('says which copy differs when only the metadata of a record was altered', async () => {
    const out = path.join(space.data, 'metadata-altered.pdf');
    expect((await runCli(['record', '--run', decidedId, '--out', out, ...dataFlags()])).code).toBe(0);
    const bytes = readFileSync(out);
    const printed = (await fingerprintFromPdf(bytes)).printed!;
    const replacement = printed.startsWith('0') ? `1${printed.slice(1)}` : `0${printed.slice(1)}`;
    // Same length, so the PDF's cross-reference offsets stay valid.
    const altered = Buffer.from(bytes.toString('latin1').replaceAll(`sha256:${printed}`, `sha256:${replacement}`), 'latin1');
    await writeFile(out, altered);
    const verified = await runCli(['verify', '--run', decidedId, '--pdf', out, '--json', ...dataFlags()]);
    expect(verified.code).toBe(1);
    expect(JSON.parse(verified.stdout).record).toMatchObject({ printed, matches: false, differs: ['metadata'] });
  }, 60_000);

  it('exports the entries as CSV with a header row, the voided entry marked', async () => {
    const out = path.join(space.data, 'entries.csv');
    const exported = await runCli(['export', '--run', decidedId, '--out', out, ...dataFlags()]);
    expect(exported.code).toBe(0);
    const lines = readFileSync(out, 'utf8').split('\r\n');
    expect(lines[0]).toBe('sequence,recorded_at,item_id,result,nonconformities,category,note,actor,voided,void_reason,void_sequence,voided_at,void_actor');
    // 58 results and the trailing CRLF.
    expect(lines).toHaveLength(1 + 58 + 1);
    expect(lines.find((line) => line.includes('KF-0011'))).toContain('nonconforming,1,thread damage,"NO-GO gauge entered 2 turns, part ""quarantined"", tray 4",A. Brennan,no');
    expect(lines.filter((line) => line.includes(',yes,"keyed against the wrong tray position, re-gauged",13,'))).toHaveLength(1);
  }, 60_000);

  it.each([
    [['record', '--out', 'x.pdf'], '--run is required'],
    [['record', '--run', 'run-1'], '--out is required'],
    [['record', '--run', 'run-1', '--out', 'record.txt'], '--out must be a file path ending in .pdf'],
    [['record', '--run', '../../etc/passwd', '--out', 'x.pdf'], '--run must be a run id'],
    [['record', '--run', 'run-1', '--out', 'x.pdf', '--colour', 'red'], 'unknown flag --colour'],
    [['verify', '--run', 'run-1', '--pdf'], '--pdf needs a value'],
    [['export', '--run', 'run-1'], '--out is required'],
  ])('%j exits 2 with one line naming the flag', async (args, expected) => {
    const result = await runCli(args);
    expect(result.code).toBe(2);
    expect(result.stderr).toContain(expected);
    expect(result.stderr.trim().split('\n')).toHaveLength(1);
  }, 30_000);

  it('exits 1 with one line for a run that does not exist', async () => {
    const result = await runCli(['record', '--run', 'run-20250101-00000000', '--out', path.join(space.data, 'none.pdf'), ...dataFlags()]);
    expect(result.code).toBe(1);
    expect(result.stderr).toBe(`tallyline record: there is no run run-20250101-00000000 in the data folder ${space.data}\n`);
  }, 30_000);
});
