// How typed search text becomes FULLTEXT words. The stopword list and the three-character minimum
// are InnoDB's defaults (MariaDB Knowledge Base, "Full-Text Index Stopwords" and
// innodb_ft_min_token_size = 3); the rest is our own rule for keeping syntax out of the query.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { searchWords, snippetAround } from '../../server/features/logbook/search';

describe('searchWords', () => {
  it('keeps words of three or more letters or digits, lower-cased, once each', () => {
    expect(searchWords('Vacuum LOSS on the pump, vacuum again')).toEqual(['vacuum', 'loss', 'pump', 'again']);
  });

  it('keeps tags and other hyphen- or slash-joined terms whole, joined with _ as the index stores them', () => {
    expect(searchWords('1-CWP-B tripped; WP-1187 in force, 4/20 mA')).toEqual(['1_cwp_b', 'tripped', 'wp_1187', 'force', '4_20']);
  });

  it('drops InnoDB default stopwords (MariaDB KB, InnoDB stopword list)', () => {
    expect(searchWords('what was the level of the tower with this')).toEqual(['level', 'tower']);
  });

  it('turns boolean operators, quotes and wildcards into plain words', () => {
    expect(searchWords('"air ejector" +steam -gland* ~seal <leak> (valve) @3')).toEqual(['air', 'ejector', 'steam', 'gland', 'seal', 'leak', 'valve']);
    expect(searchWords('--- +-+ a--b')).toEqual([]);
  });

  it('keeps letters outside ASCII (station staff write in their own languages)', () => {
    expect(searchWords('Kühlturm Lüfter ΔP')).toEqual(['kühlturm', 'lüfter']);
  });

  it('never lets a character of FULLTEXT syntax through, for any input (property)', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 300 }), (text) => {
        for (const word of searchWords(text)) expect(word).toMatch(/^[\p{L}\p{N}_]{3,}$/u);
        expect(searchWords(text).length).toBeLessThanOrEqual(12);
      }),
    );
  });
});

describe('snippetAround', () => {
  it('shows the text around the first word found, with ellipses where it was cut', () => {
    const body = `${'a'.repeat(300)} the hotwell level rose ${'b'.repeat(300)}`;
    const snippet = snippetAround(body, ['hotwell']);
    expect(snippet.startsWith('…')).toBe(true);
    expect(snippet.endsWith('…')).toBe(true);
    expect(snippet).toContain('the hotwell level rose');
  });
});
