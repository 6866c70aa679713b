import { render, screen } from '@testing-library/react';

import type { Revision } from '../../api/revisions';
import { ReportDownloads } from '../reports';

import { countsText, parseWhich, sideName } from './compare-screen';
import { SignatureList, totalHeatText } from './parts';
import { signingFor } from './revision-screen';

const prepared = { userId: 1, name: 'Ada Preparer', at: '2026-12-03T10:00:00.000Z' };
const checked = { userId: 2, name: 'Ben Checker', at: '2026-12-03T11:30:00.000Z' };

describe('who may sign what', () => {
  it('when a revision is prepared, then anyone but the preparer with the right role may check it', () => {
    const r = { status: 'prepared' as const, prepared, checked: null };
    expect(signingFor(r, 1, true)).toEqual({ as: null, reason: 'You prepared this revision: another member checks it.' });
    expect(signingFor(r, 2, true)).toEqual({ as: 'check', reason: null });
    expect(signingFor(r, '2', true).as).toBe('check');
    expect(signingFor(r, 3, false)).toEqual({ as: null, reason: 'Owners and engineers sign revisions.' });
  });

  it('when a revision is checked, then neither the preparer nor the checker may approve it; a third member may', () => {
    const r = { status: 'checked' as const, prepared, checked };
    expect(signingFor(r, 1, true).reason).toMatch(/You prepared/);
    expect(signingFor(r, 2, true).reason).toMatch(/You checked/);
    expect(signingFor(r, 3, true)).toEqual({ as: 'approve', reason: null });
  });

  it('when a revision is issued, then nobody signs it again', () => {
    expect(signingFor({ status: 'issued', prepared, checked }, 3, true)).toEqual({ as: null, reason: null });
  });
});

describe('comparison words', () => {
  it('when counts are given, then the summary reads them in order with the thickness changes', () => {
    expect(countsText({ added: 2, removed: 1, changed: 5, unchanged: 200, thicknessChanged: 3 })).toBe('2 added · 1 removed · 5 changed (3 with a new thickness) · 200 unchanged');
    expect(sideName({ kind: 'draft' })).toBe('the draft');
    expect(sideName({ kind: 'revision', id: 4, number: 'B', status: 'issued', issuedAt: null })).toBe('Rev B');
  });

  it('when the address names a side, then it is a revision id or the draft; anything else leaves the server default', () => {
    expect(parseWhich('12')).toBe(12);
    expect(parseWhich('draft')).toBe('draft');
    expect(parseWhich('12a')).toBeNull();
    expect(parseWhich(undefined)).toBeNull();
  });

  it('when a total heat flow is shown, then it is kW in SI and Btu/h in US units, three significant figures', () => {
    expect(totalHeatText(1_081_234, 'SI')).toBe('1,080 kW');
    expect(totalHeatText(1000, 'US')).toBe('3,410 Btu/h');
  });
});

describe('signatures and downloads', () => {
  it('when a revision is partly signed, then each role shows the name and time, or that it is not yet signed', () => {
    const r = { prepared, checked, approved: null } as unknown as Revision;
    render(<SignatureList revision={r} testID="sigs" />);
    expect(screen.getByTestId('sigs-prepared').textContent).toBe('Ada Preparer · 3 Dec 2026, 10:00 UTC');
    expect(screen.getByTestId('sigs-checked').textContent).toBe('Ben Checker · 3 Dec 2026, 11:30 UTC');
    expect(screen.getByTestId('sigs-approved').textContent).toBe('not yet signed');
  });

  it('when reports are offered for a revision, then each is a download link to its PDF and CSV in the chosen units', () => {
    render(<ReportDownloads siteId={7} revision={42} units="US" label="Rev C" />);
    const pdf = screen.getByTestId('download-rev-42-insulation-schedule-pdf');
    expect(pdf.tagName).toBe('A');
    expect(pdf.getAttribute('href')).toBe('/api/v1/sites/7/reports/insulation-schedule.pdf?revision=42&units=US');
    expect(pdf.hasAttribute('download')).toBe(true);
    expect(pdf.getAttribute('aria-label')).toBe('Insulation schedule, Rev C, PDF in US customary units');
    expect(screen.getByTestId('download-rev-42-take-off-csv').getAttribute('href')).toBe('/api/v1/sites/7/reports/take-off.csv?revision=42&units=US');
    expect(screen.getAllByRole('link')).toHaveLength(6);
  });

  it('when reports are offered for the draft, then the links carry no revision', () => {
    render(<ReportDownloads siteId={7} revision={null} units="SI" label="draft" />);
    expect(screen.getByTestId('download-draft-heat-loss-summary-csv').getAttribute('href')).toBe('/api/v1/sites/7/reports/heat-loss-summary.csv?units=SI');
  });
});
