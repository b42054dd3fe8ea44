#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""check-catalogues.py PO_DIR: every catalogue in PO_DIR/LINGUAS compiles with
`msgfmt --check --statistics`, with no fuzzy and no untranslated message. Fails naming the
catalogue and what is wrong."""
import os
import re
import subprocess
import sys

po_dir = sys.argv[1]
langs = []
with open(os.path.join(po_dir, 'LINGUAS'), encoding='utf-8') as f:
    for line in f:
        line = line.split('#', 1)[0].strip()
        langs.extend(line.split())
if not langs:
    sys.exit('LINGUAS: no language listed')

failed = 0
for lang in langs:
    po = os.path.join(po_dir, lang + '.po')
    r = subprocess.run(['msgfmt', '--check', '--statistics', '-o', os.devnull, po],
                       capture_output=True, text=True, env=dict(os.environ, LC_ALL='C'))
    stats = r.stderr.strip().splitlines()[-1] if r.stderr.strip() else ''
    print(f'{lang}: {stats}')
    translated = re.search(r'(\d+) translated', stats)
    fuzzy = re.search(r'(\d+) fuzzy', stats)
    untranslated = re.search(r'(\d+) untranslated', stats)
    if r.returncode != 0:
        print(f'{po}: msgfmt --check failed:\n{r.stderr}', file=sys.stderr)
        failed += 1
    elif translated is None or int(translated.group(1)) == 0:
        print(f'{po}: no translated message', file=sys.stderr)
        failed += 1
    elif fuzzy or untranslated:
        print(f'{po}: {stats} (every message must be translated and none fuzzy)',
              file=sys.stderr)
        failed += 1
sys.exit(1 if failed else 0)
