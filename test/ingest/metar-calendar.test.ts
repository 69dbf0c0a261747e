/**
 * Year/month for METAR reports (a report holds day, hour, minute only — WMO-No. 306 FM 15 group YYGGggZ):
 * archive stamps, month option, dated file names, month and year ends. Rules are common practice, no source.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { decodeMetar, decodeMetarAt, isParseIssue, readMetarText, reportTimeMs, yearMonthFromFileName } from '../../src/ingest/metar.js';

test('yearMonthFromFileName reads dated names and ignores station numbers', () => {
  assert.equal(yearMonthFromFileName('KORD_2024-02-27_28_metar.txt'), { year: 2024, month: 2, day: 27 });
  assert.equal(yearMonthFromFileName('/data/metar/KJFK_20191101.txt'), { year: 2019, month: 11, day: 1 });
  assert.equal(yearMonthFromFileName('KJFK_2019-11_to_2020-02_asos.csv'), { year: 2019, month: 11 });
  assert.equal(yearMonthFromFileName('obs_202312.txt'), { year: 2023, month: 12 });
  assert.equal(yearMonthFromFileName('KORD_2024_02_27.txt'), { year: 2024, month: 2, day: 27 });
  assert.is(yearMonthFromFileName('72530094846.csv'), null);
  assert.is(yearMonthFromFileName('metar.txt'), null);
  assert.is(yearMonthFromFileName('x_2024-13-01.txt'), null);
});

test('reportTimeMs: archive stamp 2020-01-01 and report day 31 → 2019-12-31 (year end)', () => {
  assert.is(reportTimeMs(31, 23, 51, { year: 2020, month: 1, refDay: 1 }), Date.UTC(2019, 11, 31, 23, 51));
  // report day more than a few days after the stamp day → previous month
  assert.is(reportTimeMs(20, 12, 0, { year: 2024, month: 3, refDay: 10 }), Date.UTC(2024, 1, 20, 12, 0));
  // stamp just before a month turn, report just after
  assert.is(reportTimeMs(1, 0, 5, { year: 2024, month: 1, refDay: 31 }), Date.UTC(2024, 1, 1, 0, 5));
  assert.is(reportTimeMs(27, 8, 51, { year: 2024, month: 2, refDay: 27 }), Date.UTC(2024, 1, 27, 8, 51));
  // no reference day: the month as given; a day the month lacks → NaN
  assert.is(reportTimeMs(29, 0, 0, { year: 2024, month: 2 }), Date.UTC(2024, 1, 29));
  assert.ok(Number.isNaN(reportTimeMs(30, 0, 0, { year: 2024, month: 2 })));
});

test('readMetarText: archive prefixes YYYYMMDDHHMM and ISO forms, with month/year rollover', () => {
  const text = [
    '201912312351 METAR KJFK 312351Z 27010KT 10SM CLR M02/M08 A3010',
    '202001010005 METAR KJFK 312355Z 27010KT 10SM CLR M02/M08 A3010',
    '2020-01-01T00:51:00Z KJFK 010051Z 27010KT 10SM CLR M03/M08 A3011',
    '2020-01-01 01:51 SPECI KJFK 010151Z 27012KT 10SM CLR M03/M09 A3012=',
  ].join('\n');
  const { observations, report } = readMetarText(text, 'no-date-here.txt');
  assert.is(report.parsed, 4);
  assert.equal(
    observations.map((o) => o.timeMs),
    [Date.UTC(2019, 11, 31, 23, 51), Date.UTC(2019, 11, 31, 23, 55), Date.UTC(2020, 0, 1, 0, 51), Date.UTC(2020, 0, 1, 1, 51)],
  );
  assert.is(observations[3]!.source, 'SPECI');
  assert.ok(report.notes.some((n) => n.includes('archive timestamps')));
});

test('readMetarText: dated file name, reports run across month and year ends', () => {
  const text = ['KXYZ 302351Z 27010KT 10SM CLR 01/M05 A3010', 'KXYZ 312351Z 27010KT 10SM CLR 01/M05 A3010', 'KXYZ 010051Z 27010KT 10SM CLR 01/M05 A3010', 'KXYZ 020051Z 27010KT 10SM CLR 01/M05 A3010'].join('\n');
  const { observations, report } = readMetarText(text, 'KXYZ_2019-12-30_metar.txt');
  assert.equal(
    observations.map((o) => new Date(o.timeMs).toISOString()),
    ['2019-12-30T23:51:00.000Z', '2019-12-31T23:51:00.000Z', '2020-01-01T00:51:00.000Z', '2020-01-02T00:51:00.000Z'],
  );
  assert.ok(report.notes[0]!.includes('file name'));
});

test('readMetarText: month option wins over the file name; no source → every report refused (no-year-month)', () => {
  const line = 'METAR KXYZ 151200Z 27010KT 10SM CLR 01/M05 A3010';
  const a = readMetarText(line, 'KXYZ_2019-12-30.txt', { month: '2021-06' });
  assert.is(a.observations[0]!.timeMs, Date.UTC(2021, 5, 15, 12));
  const b = readMetarText(`${line}\n${line}\n`, 'metar.txt');
  assert.is(b.observations.length, 0);
  assert.is(b.report.rejectedByReason['no-year-month'], 2);
  assert.ok(b.report.issues[0]!.message.includes('--month YYYY-MM'));
  assert.ok(b.report.notes.some((n) => n.includes('--month YYYY-MM')));
  assert.throws(() => readMetarText(line, 'x.txt', { month: '2021-6' }), RangeError);
});

test('readMetarText accounts for every non-blank line (comment, NIL, not-a-report, bad-time)', () => {
  const text = ['# header', '', 'METAR KXYZ 151200Z 27010KT 10SM CLR 01/M05 A3010', 'METAR KXYZ 151300Z NIL=', 'garbage line', 'KXYZ 311300Z 27010KT', '   '].join('\n');
  const { report } = readMetarText(text, 'x_2024-02.txt');
  assert.is(report.lines, 5);
  assert.is(report.parsed, 1);
  assert.is(report.rejected, 4);
  assert.equal(report.rejectedByReason, { comment: 1, 'nil-report': 1, 'not-a-report': 1, 'bad-time': 1 });
  const bad = report.issues.find((i) => i.reason === 'bad-time')!;
  assert.is(bad.line, 6);
  assert.is(bad.group, '311300Z');
});

test('decodeMetarAt dates the raw METAR from the CSV observation time (IEM `valid` + `metar` columns)', () => {
  const r = decodeMetarAt('KJFK 010024Z 18026G31KT 6SM BR OVC005 19/19 A2968 RMK AO2 PK WND 18032/0010 T01890189 $', Date.UTC(2019, 10, 1, 0, 24), 'kjfk.csv', 2);
  assert.not.ok(isParseIssue(r));
  if (!isParseIssue(r)) assert.is(r.timeMs, Date.UTC(2019, 10, 1, 0, 24));
  // CSV time just after midnight on the 1st, report from the 31st
  const s = decodeMetarAt('KJFK 312359Z 18010KT 10SM CLR 05/01 A3000', Date.UTC(2020, 0, 1, 0, 1), 'f', 3);
  if (!isParseIssue(s)) assert.is(s.timeMs, Date.UTC(2019, 11, 31, 23, 59));
  assert.is((decodeMetarAt('KJFK 312359Z', NaN, 'f', 4) as { reason: string }).reason, 'no-time');
  // the `refDay` of decodeMetar with archive semantics
  const t = decodeMetar('KJFK 312359Z 18010KT', { year: 2020, month: 1, refDay: 1, file: 'f', line: 1 });
  if (!isParseIssue(t)) assert.is(t.timeMs, Date.UTC(2019, 11, 31, 23, 59));
});

test.run();
