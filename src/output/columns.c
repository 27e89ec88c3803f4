/* columns.c: the column reference (schema.h): every output file's columns or rows with
 * unit and meaning, as markdown (`volev columns`, docs/columns.md). */
#include "output_internal.h"
#include "volev/process.h"
#include "volev/redox_ledger.h"
#include "volev/schema.h"

/* series.csv: the fixed columns, the reservoir masses, every process's fluxes. */
static void series_reference(FILE *out)
{
    char codes[256];
    fprintf(out, "## series.csv\n\nOne row per output age and per event, columns in this "
                 "order. Masses and fluxes print an integrator overshoot below zero as 0.\n\n");
    fprintf(out, "Empty fields: a quantity that has no value (the D/H ratio of water that "
                 "is not there, the age of something that never happened, a ratio to zero) "
                 "is an empty field. No file volev writes (series.csv, events.csv, "
                 "summary.csv; a sweep's members.csv, ensemble_summary.csv, "
                 "ensemble_series.csv, sensitivity.csv; balance.csv, compare.csv) ever holds "
                 "`nan` or `inf`, and a zero is written `0`, never `-0`. The summary rows that "
                 "can be empty say so below; a sweep's outcomes: docs/ensembles.md.\n\n");
    fprintf(out, "| column | unit | meaning |\n|---|---|---|\n");
    for (int id = 0; id < VL_NSERIES; id++) {
        const vl_series_column *c = &vl_series_columns[id];
        vl_series_codes(id, codes, sizeof codes);
        fprintf(out, "| `%s` | %s | %s%s%s |\n", c->name, c->unit, c->meaning,
                codes[0] ? ": " : "", codes);
    }
    for (int r = 0; r < VL_NRES; r++)
        fprintf(out, "| `%s_kg` | kg | reservoir: %s |\n", vl_reservoir_name(r),
                vl_reservoir_meaning(r));
    fprintf(out, "\nThen one column per flux of every process the scenario switches on "
                 "(kg/s), in the order of `volev processes`:\n\n");
    fprintf(out, "| column | process | meaning |\n|---|---|---|\n");
    for (size_t k = 0; k < vl_nprocesses; k++)
        for (size_t c = 0; c < vl_processes[k]->ncolumns; c++)
            fprintf(out, "| `%s` | %s | %s |\n", vl_processes[k]->columns[c].name,
                    vl_processes[k]->name, vl_processes[k]->columns[c].meaning);
    fprintf(out, "\nThen one redox column per process the scenario switches on whose declared "
                 "transfers or reactions can change the redox content of the air and ocean "
                 "(kg O-equivalent/s, signed: positive when the process is an oxidant source "
                 "for the surface; docs/model.md section 1), in the same order:\n\n");
    fprintf(out, "| column | process | meaning |\n|---|---|---|\n");
    for (size_t k = 0; k < vl_nprocesses; k++)
        if (vl_redox_touches_surface(vl_processes[k]))
            fprintf(out, "| `redox_%s_kg_s` | %s | the process's tendency of "
                         "`surface_oxidant_kg` |\n",
                    vl_processes[k]->name, vl_processes[k]->name);
}

const vl_event_column vl_event_columns[VL_NEVENT_COLUMNS] = {
    {"time_yr", "yr", "stellar age of the event"},
    {"event", "", "kind: start, end, a regime's onset or end (e.g. runaway_onset, thaw), "
                  "reservoir_exhausted"},
    {"detail", "", "the regimes before and after, or the reservoir (free text, may hold "
                   "commas: it runs to the end of the line)"},
};

void vl_schema_print_reference(FILE *out)
{
    series_reference(out);
    fprintf(out, "\n## events.csv\n\n| column | unit | meaning |\n|---|---|---|\n");
    for (int i = 0; i < VL_NEVENT_COLUMNS; i++)
        fprintf(out, "| `%s` | %s | %s |\n", vl_event_columns[i].name, vl_event_columns[i].unit,
                vl_event_columns[i].meaning);
    fprintf(out, "\n## summary.csv\n\nRows `name,value,unit`, in this order (`<...>`: one "
                 "row per reservoir, event kind seen, regime, flux column or element).\n\n"
                 "| name | unit | meaning |\n|---|---|---|\n");
    vl_summary_print_reference(out);
}
