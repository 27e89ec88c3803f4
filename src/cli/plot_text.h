/* plot_text.h: the words of a run's history figure taken from the run (plot_text.c). */
#ifndef VOLEV_CLI_PLOT_TEXT_H
#define VOLEV_CLI_PLOT_TEXT_H

#include <stddef.h>

#include "volev/status.h"

/* The default title of run folder dir's figure: the scenario's name (the base name of
 * the file in summary.csv's "# scenario:" line, else the folder's), the planet's mass
 * and orbit and the star's mass and Teff from dir/scenario.resolved.cfg, e.g. "demo:
 * 1.2 Earth-mass planet at 0.11 au from a 0.25 solar-mass star (3250 K)"; the name
 * alone when the scenario cannot be read. Plain text (the figure shows it as written). */
void vl_plot_run_title(const char *dir, char *out, size_t n);

/* The events of events.csv at path (start and end left out) as the EVENTS argument of
 * plots/history.gp: one line "TIME GROUP TEXT" per time with events, TEXT in words with
 * the age, e.g. "6.694747607e+08 1 magma ocean solidified, runaway greenhouse began (669 Myr)";
 * times too close to tell apart on the figure share a group number and the first of
 * them carries the text of all. "" when there are none. Allocated (free it); NULL with
 * st filled on a read error. */
char *vl_plot_events_word(const char *path, vl_status *st);

#endif
