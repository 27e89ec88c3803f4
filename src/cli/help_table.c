/* help_table.c: every subcommand of volev, its synopsis, description, options and
 * examples (help.h). Each option list is read off the command's parser: args.c (run,
 * validate, balance, hz), args.c's vl_cli_take_age (--age-yr), sweep.c, plot.c, compare.c,
 * processes.c; columns.c takes no arguments. A new option goes here and into the parser; the
 * man page's OPTIONS and README.md's command list follow (tests/test_help.c). */
#include "cli.h"
#include "help.h"

#define END_OPTIONS {{NULL, NULL}, NULL, NULL}

static const vl_cli_option set_option = {
    {"-s", "--set"}, "KEY=VALUE",
    "override one scenario parameter after the file is read, in the key's file unit "
    "(planet.orbit_au=1.05, processes.weathering.enabled=false); repeatable, applied in "
    "order"};

static const vl_cli_option run_options[] = {
    {{"-o", "--output"}, "DIR",
     "output folder, made if missing; it must be empty unless --replace (default: the "
     "scenario's name, or NAME.1, NAME.2, ... if taken)"},
    {{"--replace", NULL}, NULL,
     "with -o: write the run's four files over what DIR holds (other files stay)"},
    set_option,
    END_OPTIONS,
};

static const vl_cli_option validate_options[] = {set_option, END_OPTIONS};

static const vl_cli_option balance_options[] = {
    {{"--age-yr", NULL}, "AGE",
     "stellar age in years, within the run's ages (default: run.start_yr)"},
    {{"-o", "--output"}, "DIR", "output folder, made if missing (default: NAME-balance)"},
    set_option,
    END_OPTIONS,
};

static const vl_cli_option hz_options[] = {
    {{"--age-yr", NULL}, "AGE",
     "stellar age in years, within the run's ages (default: run.end_yr)"},
    {{"-o", "--output"}, "DIR", "also write DIR/hz.csv (the folder is made if missing)"},
    set_option,
    END_OPTIONS,
};

static const vl_cli_option sweep_options[] = {
    {{"-o", NULL}, "DIR",
     "output folder (default: the scenario's file name without .cfg, plus -sweep)"},
    {{"-j", NULL}, "THREADS", "OpenMP threads, 1-1024 (default: all cores)"},
    {{"--quiet", NULL}, NULL, "no progress line on a terminal"},
    {{"--replace", NULL}, NULL,
     "run from the start in a folder holding another sweep's files or other files: an "
     "earlier sweep's files and journal are removed first, other files stay"},
    END_OPTIONS,
};

static const vl_cli_option plot_options[] = {
    {{"--kind", NULL}, "NAME",
     "the figure to make: history, balance, comparison, ensemble, regime_map or water_map "
     "(default: every figure the folder's files make)"},
    {{"-o", NULL}, "FILE",
     "write one figure to FILE, whose extension (.png, .pdf, .svg) sets the format "
     "(default: DIR/KIND.FORMAT; a comparison: comparison.FORMAT here)"},
    {{"-f", "--format"}, "png|pdf|svg", "figure format (default png, or -o's extension)"},
    {{"--title", NULL}, "TEXT", "figure title (default: from the data, e.g. the run's scenario, planet and star)"},
    {{"--list", NULL}, NULL, "list the figure kinds, the files each needs and its script"},
    END_OPTIONS,
};

static const vl_cli_option compare_options[] = {
    {{"-o", "--output"}, "DIR",
     "also write DIR/compare.csv (the table) and DIR/compare.FORMAT (the figure)"},
    {{"-f", "--format"}, "png|pdf|svg", "format of the figure (default png)"},
    {{"--labels", NULL}, "A,B,...",
     "names of the runs in the table, file and legend, one per folder (default: the "
     "folders' last path components, or the folders as given where two share one)"},
    END_OPTIONS,
};

static const vl_cli_option processes_options[] = {
    {{"--sources", NULL}, NULL,
     "instead, the audit of the sources: counts and lists of the defaults recalled "
     "\"from memory\" and of those citing no paper, handbook or dataset (the text of "
     "docs/sources.md)"},
    END_OPTIONS,
};

static const vl_cli_option no_options[] = {END_OPTIONS};

const vl_cli_command vl_cli_commands[] = {
    {"run", vl_cli_run,
     {"run SCENARIO [-o DIR [--replace]] [--set KEY=VALUE]...", NULL},
     "simulate one history",
     "Integrate the scenario's planet through its star's history and write series.csv "
     "(reservoirs, pressures, temperature, fluxes and regime against stellar age), "
     "events.csv (regime changes, exhausted reservoirs), summary.csv (final state, water "
     "lost, time in each regime, residuals, cost) and scenario.resolved.cfg (every "
     "parameter; running it again gives the same series.csv). Files appear only when the "
     "run succeeded; an interrupted run (SIGINT, SIGTERM) leaves nothing.",
     run_options,
     {{"volev run scenarios/earth.cfg -o earth", "present Earth into the new folder earth"},
      {"volev run scenarios/demo.cfg --set inventory.surface_water_to=0.3 -o dry",
       "the demo planet with 0.3 oceans of water"},
      {"volev run scenarios/earth.cfg -o earth --replace", "write over an earlier run"}}},
    {"validate", vl_cli_validate,
     {"validate SCENARIO [--set KEY=VALUE]...", NULL},
     "check a scenario, list every parameter",
     "Load and check the scenario (with its star track, and its sweep group if it has "
     "one), build the model, and print every resolved parameter with its unit and origin "
     "(file and line, default, or --set), then the star, instellation, S_eff and place in "
     "the habitable zone (Kopparapu et al. 2013) at the run's start and end. Writes "
     "nothing; exit 3 names file, line and key of the first problem.",
     validate_options,
     {{"volev validate scenarios/earth.cfg", "every parameter of the Earth scenario"},
      {"volev validate scenarios/demo.cfg --set planet.orbit_au=0.8",
       "check an override before a long run"}}},
    {"balance", vl_cli_balance,
     {"balance SCENARIO [--age-yr AGE] [-o DIR] [--set KEY=VALUE]...", NULL},
     "energy-balance curves at one age",
     "Write DIR/balance.csv: for the scenario's initial atmosphere around its star at age "
     "AGE, the outgoing longwave radiation, absorbed stellar flux, net flux, planetary "
     "albedo and stratospheric water against surface temperature, with the stable "
     "equilibria and the runaway and moist-greenhouse thresholds in its header. Needs "
     "climate.model = \"column\". 'volev plot DIR' draws it.",
     balance_options,
     {{"volev balance scenarios/demo.cfg --age-yr 1e9 -o bal",
       "the demo planet's balance at 1 Gyr into bal/"},
      {"volev plot bal", "then bal/balance.png"}}},
    {"hz", vl_cli_hz,
     {"hz SCENARIO [--age-yr AGE] [-o DIR] [--set KEY=VALUE]...", NULL},
     "habitable-zone edges of the scenario's star at one age",
     "Print the edges of the habitable zone around the scenario's star at age AGE as "
     "effective flux S_eff (1361 W/m^2 = 1) and circular-orbit distance: the fits of "
     "Kopparapu et al. 2013 for the star's Teff (recent Venus, runaway and moist "
     "greenhouse, maximum greenhouse, early Mars), the 2014 runaway fit for the planet's "
     "mass, and with climate.model = \"column\" the column's runaway and moist-greenhouse "
     "thresholds for the scenario's starting atmosphere and its maximum-greenhouse edge (the least "
     "S_eff at which a CO2 pressure of 0.1-50 bar keeps the surface at 273.15 K). With -o, "
     "also DIR/hz.csv.",
     hz_options,
     {{"volev hz scenarios/earth.cfg", "the Sun's habitable zone today"},
      {"volev hz scenarios/demo.cfg --age-yr 1e9 --set planet.mass_mearth=3 -o hz",
       "the demo star at 1 Gyr, for a 3 Earth-mass planet"}}},
    {"sweep", vl_cli_sweep,
     {"sweep SCENARIO [-o DIR] [-j THREADS] [--quiet] [--replace]", NULL},
     "run the ensemble of the scenario's sweep group",
     "Run every member of the scenario's sweep group (a design over axes or a catalogue of "
     "candidates, docs/ensembles.md) on threads and, in a 'make MPI=1' build under mpirun, "
     "on MPI ranks; write members.csv, ensemble_summary.csv, ensemble_series.csv and, for "
     "a saltelli design, sensitivity.csv. The results do not depend on thread or rank "
     "count. An interrupted sweep resumes with the same command and runs only the members "
     "it lacks; the folder is locked while a sweep runs.",
     sweep_options,
     {{"volev sweep scenarios/demo-sweep.cfg -o demo-map -j 2",
       "the orbit x water grid on 2 threads"},
      {"volev sweep scenarios/demo-sensitivity.cfg -o demo-sens --quiet",
       "Sobol indices: which input matters"},
      {"mpirun -n 2 build-mpi/volev sweep scenarios/demo-sweep.cfg -o map-mpi",
       "the same on 2 MPI ranks"}}},
    {"plot", vl_cli_plot,
     {"plot DIR... [--kind NAME] [-o FILE] [--format png|pdf|svg] [--title TEXT]",
      "plot --list"},
     "render the figures of run, balance or sweep folders",
     "Render with gnuplot the figures of what the folder holds (docs/figures.md): history "
     "(a run), balance (volev balance), ensemble, and for a grid sweep over two axes "
     "regime_map and water_map; 2 to 12 run folders make a comparison. Every input "
     "is checked for the columns its figure needs before gnuplot runs. The scripts are "
     "found in $VOLEV_PLOTS_DIR, or beside the program in ../plots or "
     "../share/volev/plots.",
     plot_options,
     {{"volev plot earth --format pdf", "earth/history.pdf"},
      {"volev plot wet dry --title \"Wet and dry\" -o wet-vs-dry.png",
       "two runs on shared axes"},
      {"volev plot venus earth mars -o planets.pdf", "three runs, up to 12"},
      {"volev plot demo-map --kind regime_map", "demo-map/regime_map.png"},
      {"volev plot --list", "every figure kind"}}},
    {"compare", vl_cli_compare,
     {"compare DIR_A DIR_B [DIR...] [-o DIR] [--format png|pdf|svg] [--labels A,B,...]", NULL},
     "side-by-side table and figure of 2 to 12 runs",
     "Print the runs' final state (regime, surface temperature and pressure from the last "
     "row of series.csv) and every quantity of their summary.csv, grouped by topic: final "
     "state, water and escape budgets, redox budget, isotopes, time in regimes and first "
     "events (the stellar age at which each kind of event first happened, or never), "
     "then conservation, numerics and cost. Each run's value is shown; with two runs also "
     "B-A and B/A, a ratio only where both values are above the quantity's numerical "
     "resolution (docs/figures.md). With -o, also write compare.csv and a figure of "
     "surface water, CO2, O2 and surface temperature of the runs on shared axes.",
     compare_options,
     {{"volev compare wet dry", "the table on the terminal"},
      {"volev compare wet dry -o wet-vs-dry --labels ocean,desert --format svg",
       "also wet-vs-dry/compare.csv and compare.svg"},
      {"volev compare venus earth mars -o planets", "three runs, up to 12"}}},
    {"processes", vl_cli_processes,
     {"processes [--sources]", NULL},
     "list processes and parameters with units, defaults, bounds, references",
     "Print every parameter group and process: each parameter with its type, unit, "
     "default, bounds or choices, meaning and reference, and each process's output "
     "columns (the text of docs/parameters.md). With --sources, print instead which "
     "defaults rest on values recalled 'from memory' and which cite no paper, handbook "
     "or dataset, with their counts (the text of docs/sources.md).",
     processes_options,
     {{"volev processes | less", "read the reference"},
      {"volev processes --sources | less", "the defaults a referee should check first"}}},
    {"columns", vl_cli_columns,
     {"columns", NULL},
     "list every output column and summary row with its unit and meaning",
     "Print every column of series.csv and events.csv and every row of summary.csv with "
     "its unit and meaning (the text of docs/columns.md).",
     no_options,
     {{"volev columns | grep escape", "the escape columns"}}},
    {"help", vl_cli_help,
     {"help [COMMAND]", NULL},
     "this overview, or one command's options and examples",
     "Without COMMAND, the list of commands; with it, the command's synopsis, description, "
     "options and examples, as 'volev COMMAND --help' prints them. -h or --help anywhere "
     "among a command's arguments (except as an option's value) does the same and "
     "runs nothing.",
     no_options,
     {{"volev help run", "the options of run"},
      {"volev run scenarios/earth.cfg --help", "the same"}}},
    {NULL, NULL, {NULL, NULL}, NULL, NULL, NULL, {{NULL, NULL}}},
};
