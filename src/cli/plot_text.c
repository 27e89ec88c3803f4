/* plot_text.c: the words a run's figure shows that come from the run itself (plot_text.h):
 * the default title, from the scenario the run resolved, and the labelled events, from
 * its events.csv. */
#include "plot_text.h"

#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "path_name.h"
#include "volev/csv.h"
#include "volev/scenario.h"
#include "volev/units.h"

/* The scenario file named by the "# scenario: PATH" comment of dir/summary.csv, as its
 * base name; "" when there is none. */
static void scenario_name(const char *dir, char *out, size_t n)
{
    char path[4200];
    out[0] = '\0';
    snprintf(path, sizeof path, "%s/summary.csv", dir);
    static const vl_csv_options head = {0, SIZE_MAX, 0, 1, NULL, NULL};
    vl_status st;
    vl_csv_table *t = vl_csv_read(path, &head, &st);
    if (!t)
        return;
    for (size_t c = 0; c < t->ncomments; c++)
        if (strncmp(t->comments[c].text, "# scenario: ", 12) == 0) {
            vl_cli_path_name(t->comments[c].text + 12, ".cfg", out, n);
            break;
        }
    vl_csv_free(t);
}

void vl_plot_run_title(const char *dir, char *out, size_t n)
{
    char name[1024], path[4200];
    scenario_name(dir, name, sizeof name);
    if (!name[0])
        vl_cli_path_name(dir, ".cfg", name, sizeof name);
    snprintf(path, sizeof path, "%s/scenario.resolved.cfg", dir);
    vl_status st;
    vl_scenario *sc = vl_scenario_load(path, NULL, 0, &st);
    if (!sc) {
        snprintf(out, n, "%s", name);
        return;
    }
    snprintf(out, n, "%s: %.3g Earth-mass planet at %.3g au from a %.3g solar-mass star (%.0f K)",
             name, sc->planet.mass_kg / VL_M_EARTH, sc->planet.orbit_m / VL_AU,
             sc->star.mass_kg / VL_M_SUN, sc->star.teff_k);
    vl_scenario_free(sc);
}

/* "109 Myr", "3.07 Gyr", "850 kyr", "12 yr": three significant digits. */
static void age_words(double yr, char *out, size_t n)
{
    static const struct {
        double scale;
        const char *unit;
    } u[] = {{1e9, "Gyr"}, {1e6, "Myr"}, {1e3, "kyr"}, {1.0, "yr"}};
    size_t k = 0;
    while (k + 1 < sizeof u / sizeof u[0] && yr < u[k].scale)
        k++;
    snprintf(out, n, "%.3g %s", yr / u[k].scale, u[k].unit);
}

/* An event in words: "runaway greenhouse began", "surface water used up". */
static void event_words(const char *event, const char *detail, char *out, size_t n)
{
    static const char *const names[][2] = {
        {"ocean_lost", "ocean lost"},
        {"freeze", "surface froze"},
        {"thaw", "surface thawed"},
        {"temperate_onset", "temperate climate began"},
        {"temperate_end", "temperate climate ended"},
        {"moist_greenhouse_onset", "moist greenhouse began"},
        {"moist_greenhouse_end", "moist greenhouse ended"},
        {"runaway_onset", "runaway greenhouse began"},
        {"runaway_end", "runaway greenhouse ended"},
        {"surface_melted", "surface melted"},
        {"solidified", "magma ocean solidified"},
        {"water_returned", "water returned"},
    };
    for (size_t k = 0; k < sizeof names / sizeof names[0]; k++)
        if (strcmp(event, names[k][0]) == 0) {
            snprintf(out, n, "%s", names[k][1]);
            return;
        }
    char what[256];
    int exhausted = strcmp(event, "reservoir_exhausted") == 0;
    snprintf(what, sizeof what, "%s", exhausted ? detail : event);
    size_t len = strlen(what);
    int deuterium = exhausted && len > 2 && strcmp(what + len - 2, "_d") == 0;
    if (deuterium)
        what[len - 2] = '\0';
    for (char *c = what; *c; c++)
        if (*c == '_')
            *c = ' ';
    if (exhausted)
        snprintf(out, n, "%s%s used up", deuterium ? "deuterium of " : "", what);
    else
        snprintf(out, n, "%s", what);
}

/* The events of a run, read from events.csv. */
typedef struct {
    double t_yr;
    char text[160];
} event_t;

typedef struct {
    event_t *ev;
    size_t n, cap;
    double start_yr, end_yr;
    size_t c_time, c_event, c_detail;
} events_t;

static int take_event(void *ctx, const vl_csv_record *rec, vl_status *st)
{
    events_t *e = ctx;
    if (rec->kind == VL_CSV_HEADER) {
        e->c_time = e->c_event = e->c_detail = VL_CSV_NONE;
        for (size_t i = 0; i < rec->n; i++) {
            if (strcmp(rec->field[i], "time_yr") == 0)
                e->c_time = i;
            else if (strcmp(rec->field[i], "event") == 0)
                e->c_event = i;
            else if (strcmp(rec->field[i], "detail") == 0)
                e->c_detail = i;
        }
        if (e->c_time == VL_CSV_NONE || e->c_event == VL_CSV_NONE)
            return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line,
                           "no column '%s' (the history figure labels its events with it)",
                           e->c_time == VL_CSV_NONE ? "time_yr" : "event");
        return VL_OK;
    }
    if (rec->kind != VL_CSV_ROW)
        return VL_OK;
    char *end;
    double t = strtod(rec->field[e->c_time], &end);
    if (end == rec->field[e->c_time] || *end || !isfinite(t))
        return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line,
                       "time_yr '%s' is not a number", rec->field[e->c_time]);
    const char *name = rec->field[e->c_event];
    if (strcmp(name, "start") == 0 || strcmp(name, "end") == 0) {
        double *edge = strcmp(name, "start") == 0 ? &e->start_yr : &e->end_yr;
        *edge = t;
        return VL_OK;
    }
    if (e->n == e->cap) {
        size_t cap = e->cap ? 2 * e->cap : 16;
        event_t *p = realloc(e->ev, cap * sizeof *p);
        if (!p)
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        e->ev = p;
        e->cap = cap;
    }
    e->ev[e->n].t_yr = t;
    event_words(name, e->c_detail == VL_CSV_NONE ? "" : rec->field[e->c_detail],
                e->ev[e->n].text, sizeof e->ev[e->n].text);
    e->n++;
    return VL_OK;
}

/* Appends the text of s to the growing string *buf (length *len, capacity *cap). */
static int append(char **buf, size_t *len, size_t *cap, const char *s)
{
    size_t k = strlen(s);
    if (*len + k + 1 > *cap) {
        size_t c = (*len + k + 1) * 2;
        char *p = realloc(*buf, c);
        if (!p)
            return -1;
        *buf = p;
        *cap = c;
    }
    memcpy(*buf + *len, s, k + 1);
    *len += k;
    return 0;
}

/* The events at one time, in words: "magma ocean solidified, runaway greenhouse began
 * (109 Myr)"; returns the index past them. */
static size_t one_time(const events_t *e, size_t i, char *out, size_t n)
{
    double t = e->ev[i].t_yr;
    size_t used = 0;
    out[0] = '\0';
    for (; i < e->n && e->ev[i].t_yr == t; i++) { /* every event at t, kept while room */
        if (used >= n)
            continue;
        int k = snprintf(out + used, n - used, "%s%s", used ? ", " : "", e->ev[i].text);
        used += k > 0 ? (size_t)k : 0;
    }
    char age[32];
    age_words(t, age, sizeof age);
    if (used < n)
        snprintf(out + used, n - used, " (%s)", age);
    return i;
}

/* Groups of events numbered on the figure, and the words of one group (characters). */
enum { GROUPS_MAX = 9, GROUP_TEXT_MAX = 240 };

char *vl_plot_events_word(const char *path, vl_status *st)
{
    events_t e = {NULL, 0, 0, NAN, NAN, 0, 0, 0};
    const vl_csv_options o = {VL_CSV_REST, SIZE_MAX, 0, 0, NULL, NULL};
    if (vl_csv_scan(path, &o, take_event, &e, st) != VL_OK) {
        free(e.ev);
        return NULL;
    }
    /* One line per time with events: "TIME GROUP TEXT". Times closer than 1/60 of the
     * run's decades to the first of their group (about 8 px on the history figure's age
     * axis, too close for two numbers) share its number, and the group's first line
     * holds the words of all of them, "; " between times, up to GROUP_TEXT_MAX
     * characters ("; ..." for the rest); later lines have no text. Past GROUPS_MAX
     * groups (a climate flickering between two regimes logs many) a time has group 0
     * and no text: a line on the figure, without number or words. events.csv lists
     * events in time order. */
    double span = e.start_yr > 0 && e.end_yr > e.start_yr ? log10(e.end_yr / e.start_yr) : 1.0;
    size_t ntimes = 0;
    for (size_t i = 0; i < e.n; i++)
        ntimes += i == 0 || e.ev[i].t_yr != e.ev[i - 1].t_yr;
    char **text = calloc(ntimes ? ntimes : 1, sizeof *text);
    double *time = calloc(ntimes ? ntimes : 1, sizeof *time);
    int *group = calloc(ntimes ? ntimes : 1, sizeof *group);
    char *buf = NULL, words[2400], line[4096];
    size_t len = 0, cap = 0;
    int fail = !text || !time || !group || append(&buf, &len, &cap, "");
    size_t lead = 0; /* the first time of the current group */
    int ngroups = 0;
    for (size_t i = 0, k = 0; i < e.n && !fail; k++) {
        time[k] = e.ev[i].t_yr;
        i = one_time(&e, i, words, sizeof words);
        int joins = k > 0 && time[lead] > 0 && time[k] > 0 &&
                    log10(time[k] / time[lead]) < span / 60.0;
        if (!joins)
            lead = k;
        ngroups += !joins;
        group[k] = ngroups <= GROUPS_MAX ? ngroups : 0;
        if (group[k] == 0)
            continue;
        size_t have = text[lead] ? strlen(text[lead]) : 0;
        if (have > GROUP_TEXT_MAX) {
            if (strcmp(text[lead] + have - 3, "...") != 0)
                strcpy(text[lead] + have - 5, "; ..."); /* over the last 5 characters */
            continue;
        }
        char *p = realloc(text[lead], have + strlen(words) + 3);
        if (!p) {
            fail = 1;
            break;
        }
        if (have)
            strcat(p, "; ");
        else
            p[0] = '\0';
        strcat(p, words);
        text[lead] = p;
    }
    for (size_t k = 0; k < ntimes && !fail; k++) {
        snprintf(line, sizeof line, "%.9e %d %s\n", time[k], group[k], text[k] ? text[k] : "");
        fail = append(&buf, &len, &cap, line);
    }
    for (size_t k = 0; text && k < ntimes; k++)
        free(text[k]);
    free(text);
    free(time);
    free(group);
    free(e.ev);
    if (fail) {
        free(buf);
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    return buf;
}
