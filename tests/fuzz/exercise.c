/* exercise.c: one input through an in-memory reader and the cheap steps after it
 * (exercise.h). Shared by the fuzz targets and the regression suite. */
#include "exercise.h"

#include <math.h>
#include <stdarg.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "volev/catalogue.h"
#include "volev/model.h"
#include "volev/scenario.h"
#include "volev/star.h"

/* Catalogue rows whose overrides are applied (the rest only parse). */
#define CATALOGUE_ROWS 16

static char why_buf[2 * VL_MSG_MAX];

/* Records a broken promise; returns the text. */
__attribute__((format(printf, 1, 2)))
static const char *broken(const char *fmt, ...)
{
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(why_buf, sizeof why_buf, fmt, ap);
    va_end(ap);
    return why_buf;
}

/* After a call that succeeded (ok) or failed: a success leaves st clean; a failure sets a
 * known error code and a message. */
static const char *clean(int ok, const vl_status *st, const char *what)
{
    if (ok && st->code != VL_OK)
        return broken("%s succeeded but left code %d (%s)", what, st->code, st->msg);
    if (ok)
        return NULL;
    if (st->code <= VL_OK || st->code > VL_ERR_STOPPED)
        return broken("%s failed with code %d (message '%s')", what, st->code, st->msg);
    if (!st->msg[0])
        return broken("%s failed with code %d and no message", what, st->code);
    if (!memchr(st->msg, '\0', sizeof st->msg) || !memchr(st->file, '\0', sizeof st->file))
        return broken("%s left an unterminated message or file name", what);
    return NULL;
}

/* ---------------------------------------------------------------- scenario */

/* Every stored value of a equals that of b (reals bit for bit). */
static const char *same_values(const vl_scenario *a, const vl_scenario *b)
{
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        const vl_param *p;
        void *base_a, *base_b;
        const char *prefix;
        vl_param_at(a, i, &p, &base_a, &prefix);
        vl_param_at(b, i, &p, &base_b, &prefix);
        const char *va = (const char *)base_a + p->offset, *vb = (const char *)base_b + p->offset;
        int same;
        switch (p->type) {
        case VL_PT_REAL: same = memcmp(va, vb, sizeof(double)) == 0; break;
        case VL_PT_INT: same = memcmp(va, vb, sizeof(long)) == 0; break;
        case VL_PT_BOOL:
        case VL_PT_CHOICE: same = memcmp(va, vb, sizeof(int)) == 0; break;
        default: same = strcmp(va, vb) == 0; break;
        }
        if (!same)
            return broken("the resolved scenario loads back with a different %s%s", prefix,
                          p->key);
    }
    return NULL;
}

/* The resolved scenario of sc loads back to the same values; the listing prints. */
static const char *resolved_round_trip(const vl_scenario *sc)
{
    char *text = NULL, *listing = NULL;
    size_t len = 0, listing_len = 0;
    vl_status st;
    vl_status_clear(&st);
    FILE *f = open_memstream(&text, &len);
    if (!f)
        return broken("open_memstream failed");
    int rc = vl_scenario_write_resolved(sc, f, &st);
    fclose(f);
    const char *why = rc != VL_OK ? broken("the resolved writer failed: %s", st.msg) : NULL;
    if (!why) {
        vl_scenario *again = vl_scenario_parse(text, len, "resolved.cfg", &st);
        if (!again)
            why = broken("the resolved scenario does not load back: %s:%d: %s", st.file,
                         st.line, st.msg);
        else
            why = same_values(sc, again);
        vl_scenario_free(again);
    }
    free(text);
    if (!why && (f = open_memstream(&listing, &listing_len)) != NULL) {
        vl_scenario_print(sc, f);
        fclose(f);
        free(listing);
    }
    return why;
}

/* The model of sc: built (or refused cleanly); then, with the habitable-zone-fit climate
 * (the column climate fills its table nodes on first use: too slow for a fuzzer), one
 * evaluation of the environment and the tendencies at the start. */
static const char *model_once(const vl_scenario *sc)
{
    vl_status st;
    vl_status_clear(&st);
    vl_model *m = vl_model_new(sc, &st);
    const char *why = clean(m != NULL, &st, "vl_model_new");
    if (!m)
        return why;
    double y[VL_NSTATE], dydt[VL_NSTATE];
    vl_model_initial_state(m, y);
    for (int r = 0; r < VL_NRES && !why; r++)
        if (!isfinite(y[r]))
            why = broken("initial reservoir %d is %g", r, y[r]);
    if (!why && sc->climate.model == VL_CLIMATE_HZ_FIT) {
        int regime = y[VL_R_WATER] >= sc->climate.dry_threshold_kg ? VL_REGIME_TEMPERATE
                                                                   : VL_REGIME_DRY;
        vl_env env;
        vl_work *w = vl_work_new(m, &st);
        why = clean(w != NULL, &st, "vl_work_new");
        if (w) {
            vl_model_env(m, w, sc->run.start_s, y, regime, &env);
            vl_model_rhs(m, w, sc->run.start_s, y, regime, dydt, NULL, NULL);
        }
        vl_work_free(w);
    }
    vl_model_free(m);
    return why;
}

const char *vl_fuzz_scenario(const unsigned char *data, size_t size)
{
    vl_status st;
    vl_scenario *sc = vl_scenario_parse((const char *)data, size, "fuzz.cfg", &st);
    const char *why = clean(sc != NULL, &st, "vl_scenario_parse");
    if (sc && !why)
        why = resolved_round_trip(sc);
    if (sc && !why)
        why = model_once(sc);
    vl_scenario_free(sc);
    return why;
}

/* ---------------------------------------------------------------- track */

/* A finite quantity of the star's state, positive (or, with zero_ok, not negative:
 * power laws over extreme ages and values may underflow to 0), or a broken promise. */
static const char *sane(double v, int zero_ok, const char *name, double t_s)
{
    if (isfinite(v) && (v > 0.0 || (zero_ok && v == 0.0)))
        return NULL;
    return broken("%s = %g at age %.17g s inside the track", name, v, t_s);
}

/* The ages a run may span (s): from the lower bound of run.start_yr to the upper bound of
 * run.end_yr in the parameter table. */
static void runnable_ages(double *lo_s, double *hi_s)
{
    *lo_s = 0.0;
    *hi_s = HUGE_VAL;
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, i, &p, &base, &prefix);
        if (prefix[0] == '\0' && strcmp(p->key, "run.start_yr") == 0)
            *lo_s = p->lo * p->to_si;
        if (prefix[0] == '\0' && strcmp(p->key, "run.end_yr") == 0)
            *hi_s = p->hi * p->to_si;
    }
}

const char *vl_fuzz_track(const unsigned char *data, size_t size)
{
    vl_status st;
    vl_star_track *t = vl_star_track_parse((const char *)data, size, "fuzz.csv", &st);
    const char *why = clean(t != NULL, &st, "vl_star_track_parse");
    if (!t || why) {
        vl_star_track_free(t);
        return why;
    }
    double first, last;
    vl_star_track_span(t, &first, &last);
    if (vl_star_track_rows(t) < 2 || !(first > 0.0 && last > first && isfinite(last))) {
        why = broken("track of %zu rows spans %g-%g s", vl_star_track_rows(t), first, last);
        vl_star_track_free(t);
        return why;
    }
    vl_scenario *defaults = vl_scenario_new();
    if (!defaults) {
        vl_star_track_free(t);
        return broken("out of memory");
    }
    /* the run: the track's ages, within those a run may span when they overlap (a star
     * evaluated at ages no run reaches may overflow, e.g. the wind's power law) */
    double lo, hi;
    runnable_ages(&lo, &hi);
    int runnable = first <= hi && last >= lo;
    if (runnable) {
        first = first > lo ? first : lo;
        last = last < hi ? last : hi;
    }
    vl_status_clear(&st);
    vl_star *s = vl_star_new_track(&defaults->star, t, first, last, &st);
    if (!s)
        why = broken("a star over the track's own ages was refused: %s", st.msg);
    for (int k = 0; s && runnable && !why && k <= 8; k++) {
        double age = k == 0 ? first : k == 8 ? last : first * pow(last / first, k / 8.0);
        if (age < first || age > last)
            continue;
        vl_star_state o;
        vl_star_eval(s, age, &o);
        why = sane(o.l_bol_w, 0, "luminosity", age);
        if (!why)
            why = sane(o.teff_k, 1, "effective temperature", age);
        if (!why)
            why = sane(o.l_xuv_w, 1, "XUV luminosity", age);
        if (!why)
            why = sane(o.lya_flux_1au, 1, "Lyman-alpha flux", age);
        if (!why)
            why = sane(o.wind_mdot_kg_s, 1, "wind mass-loss rate", age);
    }
    vl_star_free(s);
    vl_scenario_free(defaults);
    return why;
}

/* ---------------------------------------------------------------- catalogue */

/* The overrides of row r applied to sc, each accepted or refused cleanly. */
static const char *apply_row(const vl_catalogue *c, size_t r, vl_scenario *sc)
{
    char **set = calloc(c->ncols ? c->ncols : 1, sizeof *set);
    if (!set)
        return broken("out of memory");
    size_t n = vl_catalogue_overrides(c, r, set);
    const char *why = NULL;
    if (n == SIZE_MAX) {
        free(set);
        return broken("vl_catalogue_overrides ran out of memory");
    }
    if (n > c->ncols)
        why = broken("row %zu gave %zu overrides for %zu columns", r, n, c->ncols);
    for (size_t k = 0; k < n; k++) {
        if (!why && !strchr(set[k], '='))
            why = broken("override '%s' has no '='", set[k]);
        vl_status st;
        vl_status_clear(&st);
        if (!why) {
            int rc = vl_scenario_override(sc, set[k], &st);
            why = clean(rc == VL_OK, &st, "vl_scenario_override");
        }
        free(set[k]);
    }
    free(set);
    return why;
}

const char *vl_fuzz_catalogue(const unsigned char *data, size_t size)
{
    vl_status st;
    vl_catalogue *c = vl_catalogue_parse((const char *)data, size, "fuzz.csv", &st);
    const char *why = clean(c != NULL, &st, "vl_catalogue_parse");
    if (!c || why) {
        vl_catalogue_free(c);
        return why;
    }
    if (c->nrows == 0)
        why = broken("a catalogue without candidates was accepted");
    vl_scenario *sc = why ? NULL : vl_scenario_new();
    if (!why && !sc)
        why = broken("out of memory");
    for (size_t r = 0; !why && r < c->nrows && r < CATALOGUE_ROWS; r++) {
        if (!c->names[r] || !c->names[r][0])
            why = broken("row %zu has no name", r);
        else
            why = apply_row(c, r, sc);
    }
    if (!why && vl_catalogue_overrides(c, c->nrows, NULL) != 0)
        why = broken("overrides of a row past the end");
    vl_scenario_free(sc);
    vl_catalogue_free(c);
    return why;
}
