/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-dump-units.c: prints the unit table (kind, ASCII spelling, factor, offset) for the GNU units
 * cross-check in test-units-gnu.py. */
#include "config.h"

#include <stdio.h>

#include "engine/bw-units.h"

int
main (void)
{
  for (guint i = 0; i < bw_units_count (); i++)
    {
      const BwUnit *u = bw_units_nth (i);
      printf ("%s\t%s\t%.17g\t%.17g\n", bw_quantity_kind_name (u->kind), u->ascii, u->factor,
              u->offset);
    }
  return 0;
}
