#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""check-ui-strings.py SOURCE_ROOT: (1) no user-visible text in ui/*.ui is left without
translatable="yes"; (2) every ui file and every C source that marks strings (_(), N_(),
C_(), ngettext) is listed in po/POTFILES.in, and every file listed there exists.
Fails naming the file and line of each problem."""
import glob
import os
import re
import sys
import xml.etree.ElementTree as ET

root = sys.argv[1]
# Properties that a person reads; ids, icon names and action names are not among them.
USER_PROPS = {'label', 'title', 'tooltip-text', 'tooltip-markup', 'placeholder-text', 'text',
              'secondary-text', 'subtitle', 'description', 'comments', 'section-title',
              'accessible-name', 'accessible-description'}
problems = []


def line_of(path, elem_text, start=0):
    """The first line at or after START holding ELEM_TEXT (ElementTree keeps no lines)."""
    with open(path, encoding='utf-8') as f:
        for n, line in enumerate(f, 1):
            if n >= start and elem_text in line:
                return n
    return 0


for path in sorted(glob.glob(os.path.join(root, 'ui', '*.ui'))):
    rel = os.path.relpath(path, root)
    tree = ET.parse(path)
    last = 0
    for parent in tree.iter():
        for elem in parent:
            text = (elem.text or '').strip()
            if not text:
                continue
            name = elem.get('name')
            visible = ((elem.tag == 'property' and name in USER_PROPS)
                       or (elem.tag == 'attribute' and name == 'label')
                       or (elem.tag == 'item' and parent.tag == 'items'))
            # Inside <accessibility>, 'label' and 'description' are what a screen reader says.
            if not visible:
                continue
            # No letter at all ("%", "—"): nothing to translate. translatable="no" says on
            # purpose that the text stays as it is (a unit symbol such as "NTU").
            if not re.search(r'[^\W\d_]', text) or elem.get('translatable') == 'no':
                continue
            if elem.get('translatable') != 'yes':
                n = line_of(path, '>' + text.split('\n')[0], last) or line_of(path, text.split('\n')[0])
                last = n
                problems.append(f'{rel}:{n}: <{elem.tag} name="{name}"> "{text}" '
                                'is not marked translatable="yes"')

potfiles = os.path.join(root, 'po', 'POTFILES.in')
listed = set()
with open(potfiles, encoding='utf-8') as f:
    for n, line in enumerate(f, 1):
        entry = line.split('#', 1)[0].strip()
        if entry:
            listed.add(entry)
            if not os.path.exists(os.path.join(root, entry)):
                problems.append(f'po/POTFILES.in:{n}: {entry} does not exist')

marker = re.compile(r'(?<![A-Za-z0-9_])(_|N_|C_|NC_|ngettext)\s*\(\s*"')
candidates = glob.glob(os.path.join(root, 'src', '**', '*.[ch]'), recursive=True)
candidates += glob.glob(os.path.join(root, 'ui', '*.ui'))
for path in sorted(candidates):
    rel = os.path.relpath(path, root)
    with open(path, encoding='utf-8') as f:
        text = f.read()
    if path.endswith('.ui'):
        marked = 'translatable="yes"' in text
        first = line_of(path, 'translatable="yes"')
    else:
        m = marker.search(text)
        marked = m is not None
        first = text.count('\n', 0, m.start()) + 1 if m else 0
    if marked and rel not in listed:
        problems.append(f'{rel}:{first}: has translatable strings but is not in po/POTFILES.in')

for p in problems:
    print(p, file=sys.stderr)
print(f'{len(problems)} problem(s)')
sys.exit(1 if problems else 0)
