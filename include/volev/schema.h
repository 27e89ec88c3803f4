/* schema.h: the output schema, declared once. The columns of series.csv (series.def,
 * then one per reservoir and one per process flux) and the quantities of summary.csv,
 * each with its name, unit, one-line meaning and how it is computed. The writers, the
 * header comments, `volev columns` (docs/columns.md) and the readers of plot and compare
 * all follow from it; adding a column is one line in series.def and its function in
 * src/output/series.c. */
#ifndef VOLEV_SCHEMA_H
#define VOLEV_SCHEMA_H

#include <stdio.h>

#include "volev/env.h"
#include "volev/integrate.h"
#include "volev/model.h"

/* The fixed series columns, by ID (index into vl_series_columns). */
enum vl_series_id {
#define VL_SERIES(id, name, unit, kind, meaning) VL_SER_##id,
#include "volev/series.def"
#undef VL_SERIES
    VL_NSERIES
};

enum vl_col_kind { VL_COL_REAL, VL_COL_CODE };

/* What one series row is computed from. */
typedef struct vl_row {
    double t_s;                /* stellar age, s */
    const double *y;           /* state, kg */
    const double *dydt;        /* tendencies, kg/s */
    const double *columns;     /* process flux columns, kg/s (m->ncolumns) */
    const vl_env *env;         /* every stage at this point */
    const vl_model *m;
} vl_row;

typedef struct vl_series_column {
    const char *name;          /* CSV header name */
    const char *unit;
    int kind;                  /* enum vl_col_kind */
    const char *meaning;       /* one line */
    double (*value)(const vl_row *r);
} vl_series_column;

extern const vl_series_column vl_series_columns[VL_NSERIES];

/* Name of fixed series column id. */
const char *vl_series_name(int id);

/* The columns of events.csv: name, unit and meaning. */
#define VL_NEVENT_COLUMNS 3
typedef struct vl_event_column {
    const char *name, *unit, *meaning;
} vl_event_column;
extern const vl_event_column vl_event_columns[VL_NEVENT_COLUMNS];

/* The codes of a CODE column (e.g. "0=dry 1=frozen ..."), into buf; "" for others. */
void vl_series_codes(int id, char *buf, size_t n);

/* series.csv: its header comments and header line for m, and one row. Return -1 on a
 * write error (errno set), 0 otherwise. */
int vl_series_write_header(FILE *f, const vl_model *m);
int vl_series_write_row(FILE *f, const vl_row *r);

/* The quantities of a finished run that are derived from its final state, computed in
 * one place for summary.csv, the sweeps' outcomes and the end-of-run report. A quantity
 * without a value (the D/H of an exhausted reservoir) is NaN. */
typedef struct vl_summary {
    int regime;                /* regime of the final row */
    double surface_water_to;   /* surface water left, TO */
    double water_lost_to;      /* water whose hydrogen reached space, TO */
    double o2_bar;             /* atmospheric O2 (pressure alone), bar */
    double co2_bar;            /* CO2 in the air (pressure alone), bar */
    double ocean_co2_kg;       /* CO2 dissolved in the ocean, kg */
    double co2_ppmv;           /* CO2 mole fraction of the whole atmosphere, ppmv */
    double surface_temp_k;     /* surface temperature, K */
    double surface_pressure_bar; /* total surface pressure, bar */
    double dh_water;           /* D/H atom ratio of the surface water (once exhausted: of
                                  its last water; NaN: none, no value) */
    double dh_enrichment;      /* dh_water over the initial D/H (NaN without either) */
} vl_summary;

/* The summary of a run of m that ended with stats (its final row's stages in
 * stats->env_last). */
void vl_summary_derive(const vl_model *m, const vl_run_stats *stats, vl_summary *out);

/* Water (kg) whose hydrogen is h_kg of escaped hydrogen. */
double vl_summary_water_of_h(double h_kg);

/* The first time (s) each kind of event happened, in order of first occurrence. */
#define VL_MAX_EVENT_KINDS 64
typedef struct vl_event_firsts {
    int n;
    char name[VL_MAX_EVENT_KINDS][32];
    double t_s[VL_MAX_EVENT_KINDS];
} vl_event_firsts;

/* Note an event of kind name at t (only its first occurrence is kept). */
void vl_event_firsts_note(vl_event_firsts *e, const char *name, double t_s);

/* summary.csv's rows (name,value,unit) for a run of m with stats and its events. */
int vl_summary_write(FILE *f, const vl_model *m, const vl_run_stats *stats,
                     const vl_event_firsts *events);

/* The column reference: every series column, the generated groups, every summary
 * quantity, events.csv's columns, with units and meanings (docs/columns.md). */
void vl_schema_print_reference(FILE *out);

#endif
