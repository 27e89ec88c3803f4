/* test_csv.c: the CSV reader (src/input/csv.c, src/input/csv_table.c, include/volev/csv.h):
 * comments, header lookup, quoting, the free-text last column, field counts with line
 * numbers, the byte-order mark, empty and header-only input, files that are not regular
 * files, the size and line limits, and binary data. Every text is read from memory and,
 * where a file makes a difference, from a file too. Expected values (line numbers, field
 * texts, counts) come from the texts written beside them in this file. */
#define _GNU_SOURCE
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "suites.h"
#include "volev/csv.h"

#define LABEL "mem.csv"

static const vl_csv_options quoted = {VL_CSV_QUOTES, 0, 0, 0, NULL, NULL};

/* text read from memory; fails the test on error. */
static vl_csv_table *parse_ok(const char *text, const vl_csv_options *o)
{
    vl_status st;
    vl_csv_table *t = vl_csv_parse(text, strlen(text), LABEL, o, &st);
    ck_assert_msg(t != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    ck_assert_int_eq(st.code, VL_OK);
    return t;
}

/* text (len bytes) must fail from memory with an input error at line, needle in the
 * message. */
static void parse_fail_n(const char *text, size_t len, const vl_csv_options *o, int line,
                         const char *needle)
{
    vl_status st;
    vl_csv_table *t = vl_csv_parse(text, len, LABEL, o, &st);
    ck_assert_msg(t == NULL, "accepted, expected: %s", needle);
    ck_assert_msg(st.code == VL_ERR_INPUT && st.line == line && strstr(st.msg, needle),
                  "got code %d line %d '%s'; expected line %d '%s'", st.code, st.line, st.msg,
                  line, needle);
    ck_assert_str_eq(st.file, LABEL);
}

static void parse_fail(const char *text, const vl_csv_options *o, int line, const char *needle)
{
    parse_fail_n(text, strlen(text), o, line, needle);
}

/* A fresh file DIR/name holding len bytes of text; its path into path. */
static void write_file(const char *dir, const char *name, const char *text, size_t len,
                       char *path, size_t n)
{
    snprintf(path, n, "%s/%s", dir, name);
    FILE *f = fopen(path, "wb");
    ck_assert_ptr_nonnull(f);
    ck_assert_uint_eq(fwrite(text, 1, len, f), len);
    ck_assert_int_eq(fclose(f), 0);
}

/* Two tables hold the same header, rows, comments and line numbers. */
static void assert_same(const vl_csv_table *a, const vl_csv_table *b)
{
    ck_assert_int_eq(a->header_line, b->header_line);
    ck_assert_uint_eq(a->ncols, b->ncols);
    ck_assert_uint_eq(a->nrows, b->nrows);
    ck_assert_uint_eq(a->ncomments, b->ncomments);
    for (size_t c = 0; c < a->ncols; c++)
        ck_assert_str_eq(a->header[c], b->header[c]);
    for (size_t r = 0; r < a->nrows; r++) {
        ck_assert_int_eq(a->rows[r].line, b->rows[r].line);
        for (size_t c = 0; c < a->ncols; c++)
            ck_assert_str_eq(a->rows[r].field[c], b->rows[r].field[c]);
    }
    for (size_t c = 0; c < a->ncomments; c++) {
        ck_assert_int_eq(a->comments[c].line, b->comments[c].line);
        ck_assert_str_eq(a->comments[c].text, b->comments[c].text);
    }
}

/* ---------------------------------------------------------------- format */

/* Comments before, between and after the rows (indented ones too), blank lines, CRLF line
 * ends and no final line end. */
static const char commented[] =
    "# volev 0.1.0 (git abc)\r\n"
    "\r\n"
    "  # resolved scenario hash: 0123\n"
    "time_yr , p_co2_bar,\tregime\n"
    "1e7,0.5,temperate\n"
    "\t# between rows\n"
    "   \n"
    "2e7, 0.25 ,frozen\r\n"
    "# after the rows";

START_TEST(test_comments)
{
    vl_csv_table *t = parse_ok(commented, NULL);
    /* line numbers: the text `commented` above */
    ck_assert_int_eq(t->header_line, 4);
    ck_assert_uint_eq(t->ncomments, 4);
    const int lines[] = {1, 3, 6, 9};
    const char *texts[] = {"# volev 0.1.0 (git abc)", "# resolved scenario hash: 0123",
                           "# between rows", "# after the rows"};
    for (size_t c = 0; c < 4; c++) {
        ck_assert_int_eq(t->comments[c].line, lines[c]);
        ck_assert_str_eq(t->comments[c].text, texts[c]);
    }
    ck_assert_uint_eq(t->nrows, 2);
    ck_assert_int_eq(t->rows[0].line, 5);
    ck_assert_int_eq(t->rows[1].line, 8);
    ck_assert_str_eq(t->rows[1].field[1], "0.25");
    ck_assert_str_eq(t->rows[1].field[2], "frozen");
    ck_assert_int_eq(t->stopped, 0);

    /* the same text as a file */
    char dir[256], path[512];
    vl_status st;
    vl_test_tmp_make(dir, sizeof dir, "volev-csv");
    write_file(dir, "c.csv", commented, sizeof commented - 1, path, sizeof path);
    vl_csv_table *f = vl_csv_read(path, NULL, &st);
    ck_assert_msg(f != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    ck_assert_str_eq(f->file, path);
    assert_same(t, f);
    vl_csv_free(f);
    vl_csv_free(t);
    vl_test_tmp_remove(dir);
}
END_TEST

START_TEST(test_header_lookup)
{
    vl_csv_table *t = parse_ok("time_yr,p_co2_bar,regime\n1,2,x\n", NULL);
    /* column indices: the header above */
    ck_assert_uint_eq(vl_csv_column(t, "time_yr"), 0);
    ck_assert_uint_eq(vl_csv_column(t, "regime"), 2);
    ck_assert_uint_eq(vl_csv_column(t, "Regime"), VL_CSV_NONE);     /* exact match only */
    ck_assert_uint_eq(vl_csv_column(t, "p_co2"), VL_CSV_NONE);
    ck_assert_str_eq(t->rows[0].field[vl_csv_column(t, "regime")], "x");
    ck_assert_uint_eq(vl_csv_column(NULL, "x"), VL_CSV_NONE);
    vl_csv_free(t);
    char buf[16];
    char *f[] = {"alpha", "beta", "gamma"};
    ck_assert_str_eq(vl_csv_join(f, 2, buf, sizeof buf), "alpha,beta");
    ck_assert_str_eq(vl_csv_join(f, 3, buf, sizeof buf), "alpha,beta,g...");
}
END_TEST

START_TEST(test_quotes)
{
    vl_csv_table *t = parse_ok("name, \"value\" ,note\n"
                               "\"a, b\",\" 1 \",\"say \"\"hi\"\"\"\n"
                               "\"#1\",\"\",plain\n",
                               &quoted);
    /* expected fields: the text above */
    ck_assert_str_eq(t->header[1], "value");
    ck_assert_uint_eq(t->nrows, 2);
    ck_assert_str_eq(t->rows[0].field[0], "a, b");
    ck_assert_str_eq(t->rows[0].field[1], "1");
    ck_assert_str_eq(t->rows[0].field[2], "say \"hi\"");
    ck_assert_str_eq(t->rows[1].field[0], "#1");   /* a quoted '#' is not a comment */
    ck_assert_str_eq(t->rows[1].field[1], "");
    vl_csv_free(t);

    /* without VL_CSV_QUOTES a quote is an ordinary character and a comma always splits */
    t = parse_ok("name,value\n\"a\",\"1\"\n", NULL);
    ck_assert_str_eq(t->rows[0].field[0], "\"a\"");
    ck_assert_str_eq(t->rows[0].field[1], "\"1\"");
    vl_csv_free(t);
    parse_fail("name,value\n\"a,b\",1\n", NULL, 2, "3 fields, but the header on line 1 has 2");

    /* malformed quoting: the field is named by its header, or by its place before one */
    parse_fail("name,value\n\"a,1\n", &quoted, 2, "column 'name': unterminated quote");
    parse_fail("name,\"value\n", &quoted, 1, "header field 2: unterminated quote");
    parse_fail("name,value\na,1,\"2\n", &quoted, 2, "field 3 (the header has 2): unterminated");
    parse_fail("name\n\"a\"x\n", &quoted, 2, "column 'name': text after the closing quote");
    parse_fail("name\na\"b\"\n", &quoted, 2, "column 'name': '\"' inside an unquoted field");
    /* a record is one line: a quote cannot carry a field over a line break */
    parse_fail("name,value\n\"a\nb\",1\n", &quoted, 2, "unterminated quote");
}
END_TEST

START_TEST(test_rest)
{
    const vl_csv_options rest = {VL_CSV_REST, 0, 0, 0, NULL, NULL};
    vl_csv_table *t = parse_ok("time_yr,event,detail\n"
                               "1e7,start,temperate\n"
                               "2e7,note, a, b,, c \n",
                               &rest);
    /* the last column takes the rest of the line, commas included (text above) */
    ck_assert_uint_eq(t->ncols, 3);
    ck_assert_str_eq(t->rows[1].field[1], "note");
    ck_assert_str_eq(t->rows[1].field[2], "a, b,, c");
    vl_csv_free(t);
    /* the header itself is split at every comma, and a short row is still an error */
    parse_fail("time_yr,event,detail\n1e7,start\n", &rest, 2,
               "2 fields, but the header on line 1 has 3 (time_yr,event,detail)");
}
END_TEST

START_TEST(test_field_counts)
{
    /* line numbers count comments and blank lines (the texts below) */
    parse_fail("# c\n\nage_yr,luminosity_lsun\n1,2\n\n# c\n3\n", NULL, 7,
               "1 fields, but the header on line 3 has 2 (age_yr,luminosity_lsun)");
    parse_fail("a,b\n1,2,3\n", NULL, 2, "3 fields, but the header on line 1 has 2 (a,b)");
    parse_fail("a,b\n1,2,\n", NULL, 2, "3 fields");   /* a trailing comma makes a field */
    parse_fail("a,b\r\n1,2\r\n\r\n4\r\n", NULL, 4, "1 fields");
    /* with quotes, more fields than the header hint at quoting */
    parse_fail("name,x\nA, B,1\n", &quoted, 2,
               "3 fields, but the header on line 1 has 2 (a name or value containing a comma "
               "needs double quotes)");
    /* a long header is shortened in the message */
    char text[512];
    snprintf(text, sizeof text, "%s,%s,%s\n1\n", "a_rather_long_column_name_number_one",
             "a_rather_long_column_name_number_two", "a_rather_long_column_name_number_three");
    parse_fail(text, NULL, 2, "(a_rather_long_column_name_number_one,a_rather_long_column");
    parse_fail(text, NULL, 2, "...)");
}
END_TEST

START_TEST(test_bom)
{
    vl_csv_table *t = parse_ok("\xEF\xBB\xBF" "a,b\n1,2\n", NULL);
    ck_assert_str_eq(t->header[0], "a");   /* the mark is skipped */
    vl_csv_free(t);
    t = parse_ok("\xEF\xBB\xBF# c\na\n1\n", NULL);
    ck_assert_str_eq(t->comments[0].text, "# c");
    vl_csv_free(t);
    /* only one, and only at the very start: elsewhere U+FEFF is text like any other */
    t = parse_ok("\xEF\xBB\xBF\xEF\xBB\xBF" "a\n\xEF\xBB\xBF" "1\n", NULL);
    ck_assert_str_eq(t->header[0], "\xEF\xBB\xBF" "a");
    ck_assert_str_eq(t->rows[0].field[0], "\xEF\xBB\xBF" "1");
    vl_csv_free(t);
    /* a lone mark is an empty file */
    t = parse_ok("\xEF\xBB\xBF", NULL);
    ck_assert_int_eq(t->header_line, 0);
    vl_csv_free(t);
}
END_TEST

START_TEST(test_empty_and_header_only)
{
    const char *empty[] = {"", "\n\n", "# only\n  # comments\n\n"};
    for (size_t i = 0; i < 3; i++) {
        vl_csv_table *t = parse_ok(empty[i], NULL);
        ck_assert_int_eq(t->header_line, 0);
        ck_assert_uint_eq(t->ncols, 0);
        ck_assert_uint_eq(t->nrows, 0);
        vl_csv_free(t);
    }
    vl_status st;
    vl_csv_table *t = vl_csv_parse(NULL, 0, NULL, NULL, &st);
    ck_assert_ptr_nonnull(t);
    ck_assert_str_eq(t->file, "");
    vl_csv_free(t);
    t = parse_ok("# c\na,b\n# d\n", NULL);
    ck_assert_int_eq(t->header_line, 2);
    ck_assert_uint_eq(t->ncols, 2);
    ck_assert_uint_eq(t->nrows, 0);
    ck_assert_uint_eq(t->ncomments, 2);
    vl_csv_free(t);
    /* an empty header name is a column like any other: callers judge names */
    t = parse_ok(",b\n1,2\n", NULL);
    ck_assert_str_eq(t->header[0], "");
    vl_csv_free(t);
}
END_TEST

/* ---------------------------------------------------------------- files */

START_TEST(test_not_regular)
{
    vl_status st;
    const vl_csv_options track = {0, 0, 0, 0, "star track", NULL};
    /* /dev/null is a character device (POSIX) */
    ck_assert_ptr_null(vl_csv_read("/dev/null", &track, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT); /* the wrong kind of file: bad input */
    ck_assert_int_eq(st.line, 0);
    ck_assert_str_eq(st.file, "/dev/null");
    ck_assert_str_eq(st.msg, "cannot read star track: it is a character device, not a regular "
                             "file");
    char dir[256], path[512];
    vl_test_tmp_make(dir, sizeof dir, "volev-csv");
    ck_assert_ptr_null(vl_csv_read(dir, NULL, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_str_eq(st.msg, "cannot read CSV file: it is a folder, not a regular file");
    /* a FIFO with no writer: refused at once instead of waited on */
    snprintf(path, sizeof path, "%s/fifo", dir);
    ck_assert_int_eq(mkfifo(path, 0600), 0);
    ck_assert_ptr_null(vl_csv_read(path, NULL, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "it is a FIFO (named pipe), not a regular file"));
    /* a missing file */
    snprintf(path, sizeof path, "%s/none.csv", dir);
    ck_assert_ptr_null(vl_csv_read(path, &track, &st));
    ck_assert_int_eq(st.code, VL_ERR_IO);
    ck_assert_ptr_nonnull(strstr(st.msg, "cannot open star track: "));
    vl_test_tmp_remove(dir);
}
END_TEST

START_TEST(test_size_limit)
{
    static const char text[] = "a,b\n1,2\n3,4\n";   /* 12 bytes */
    vl_csv_options o = {0, 12, 0, 0, "catalogue", NULL};
    vl_status st;
    vl_csv_table *t = vl_csv_parse(text, 12, LABEL, &o, &st);   /* exactly the limit */
    ck_assert_ptr_nonnull(t);
    vl_csv_free(t);
    o.size_max = 11;
    ck_assert_ptr_null(vl_csv_parse(text, 12, LABEL, &o, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_int_eq(st.line, 0);
    ck_assert_str_eq(st.msg, "catalogue of 12 bytes is larger than the limit of 11 bytes");
    /* a file over the limit is refused before it is read */
    char dir[256], path[512];
    vl_test_tmp_make(dir, sizeof dir, "volev-csv");
    write_file(dir, "big.csv", text, 12, path, sizeof path);
    ck_assert_ptr_null(vl_csv_read(path, &o, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_int_eq(st.line, 0);
    ck_assert_str_eq(st.file, path);
    ck_assert_str_eq(st.msg, "catalogue of 12 bytes is larger than the limit of 11 bytes");
    o.size_max = 12;
    t = vl_csv_read(path, &o, &st);
    ck_assert_msg(t != NULL, "%s", st.msg);
    ck_assert_uint_eq(t->nrows, 2);
    vl_csv_free(t);
    vl_test_tmp_remove(dir);
    /* the default: 256 MiB (csv.h) */
    ck_assert_uint_eq(VL_CSV_SIZE_MAX, 256u * 1024 * 1024);
}
END_TEST

START_TEST(test_line_limit)
{
    /* line_max 8: "12345678" fits, with LF or CRLF; nine bytes do not */
    vl_csv_options o = {0, 0, 8, 0, NULL, NULL};
    const char *ok[] = {"a\n12345678\n", "a\r\n12345678\r\n", "a\n12345678"};
    char dir[256], path[512];
    vl_status st;
    vl_test_tmp_make(dir, sizeof dir, "volev-csv");
    for (size_t i = 0; i < 3; i++) {
        vl_csv_free(parse_ok(ok[i], &o));
        write_file(dir, "ok.csv", ok[i], strlen(ok[i]), path, sizeof path);
        vl_csv_table *t = vl_csv_read(path, &o, &st);
        ck_assert_msg(t != NULL, "%s", st.msg);
        ck_assert_str_eq(t->rows[0].field[0], "12345678");
        vl_csv_free(t);
    }
    const char *bad[] = {"a\n123456789\n", "a\n123456789\r\n", "a\n1234567\r\r\n",
                         "a\n# a long comment counts too\n"};
    for (size_t i = 0; i < 4; i++) {
        const char *needle = i == 2 ? "carriage return at byte 8" : "line longer than 8 bytes";
        parse_fail(bad[i], &o, 2, needle);
        write_file(dir, "bad.csv", bad[i], strlen(bad[i]), path, sizeof path);
        ck_assert_ptr_null(vl_csv_read(path, &o, &st));
        ck_assert_int_eq(st.line, 2);
        ck_assert_msg(strstr(st.msg, needle), "file: '%s'", st.msg);
    }
    /* a line far longer than the file reader's chunks fails without being held */
    size_t n = 300000;
    char *big = malloc(n + 3);
    ck_assert_ptr_nonnull(big);
    memcpy(big, "a\n", 2);
    memset(big + 2, 'x', n);
    big[n + 2] = '\0';
    write_file(dir, "long.csv", big, n + 2, path, sizeof path);
    o.line_max = 1000;
    ck_assert_ptr_null(vl_csv_read(path, &o, &st));
    ck_assert_int_eq(st.line, 2);
    ck_assert_str_eq(st.msg, "line longer than 1000 bytes");
    free(big);
    vl_test_tmp_remove(dir);
}
END_TEST

START_TEST(test_binary)
{
    const vl_csv_options track = {0, 0, 0, 0, NULL, "a track CSV"};
    parse_fail_n("a\n1\0\n", 5, NULL, 2, "NUL byte at byte 2 of the line: binary data, not "
                                          "CSV text");
    parse_fail("a\n1\x01\n", &track, 2, "binary data, not a track CSV: control character 0x01 "
                                        "at byte 2 of the line");
    parse_fail("# x \x1b[31m\na\n", NULL, 1, "control character 0x1B at byte 5");
    parse_fail("a\n1\x7f\n", NULL, 2, "control character 0x7F");
    parse_fail("a\n1\rb\n", NULL, 2, "carriage return at byte 2 of the line (only CRLF line "
                                     "ends are accepted)");
    parse_fail("\x89PNG\r\n\x1a\n", &track, 1, "binary data, not a track CSV: byte 0x89 at "
                                                "byte 1 of the line is not UTF-8 text");
    parse_fail("a\n\xC0\xAF\n", NULL, 2, "byte 0xC0 at byte 1");           /* overlong '/' */
    parse_fail("a\n\xED\xA0\x80\n", NULL, 2, "byte 0xED at byte 1");       /* surrogate */
    parse_fail("a\nx\xE2\x82", NULL, 2, "byte 0xE2 at byte 2");            /* cut short */
    parse_fail("a\n\xF4\x90\x80\x80\n", NULL, 2, "byte 0xF4 at byte 1");   /* above U+10FFFF */
    /* well-formed UTF-8 and TAB are text */
    vl_csv_table *t = parse_ok("name\n\xC3\x86r\xC3\xB8\tb\n", NULL);
    ck_assert_str_eq(t->rows[0].field[0], "\xC3\x86r\xC3\xB8\tb");
    vl_csv_free(t);
}
END_TEST

/* ---------------------------------------------------------------- scans */

/* Counts records; fails on the row of line fail_line, stops after stop_rows rows. */
typedef struct counter {
    int comments, headers, rows;
    int fail_line, stop_rows;
} counter;

static int count(void *ctx, const vl_csv_record *rec, vl_status *st)
{
    counter *c = ctx;
    if (rec->kind == VL_CSV_COMMENT)
        c->comments++;
    else if (rec->kind == VL_CSV_HEADER)
        c->headers++;
    else if (rec->line == c->fail_line)
        return vl_fail(st, VL_ERR_INPUT, rec->file, rec->line, "row refused");
    else if (++c->rows == c->stop_rows)
        return VL_CSV_STOP;
    if (rec->kind == VL_CSV_ROW)
        ck_assert_uint_eq(rec->ncols, rec->n);
    return VL_OK;
}

START_TEST(test_scan_and_stop)
{
    /* rows on lines 3, 4, 5 and a bad one on 6 (the text below) */
    static const char text[] = "# c\na,b\n1,2\n3,4\n5,6\n7\n";
    counter c = {0, 0, 0, 0, 0};
    vl_status st;
    ck_assert_int_eq(vl_csv_scan_buffer(text, strlen(text), LABEL, NULL, count, &c, &st),
                     VL_ERR_INPUT);
    ck_assert_int_eq(st.line, 6);
    ck_assert_int_eq(c.rows, 3);
    /* stopping before the bad row is a success */
    c = (counter){0, 0, 0, 0, 2};
    ck_assert_int_eq(vl_csv_scan_buffer(text, strlen(text), LABEL, NULL, count, &c, &st), VL_OK);
    ck_assert_int_eq(c.rows, 2);
    ck_assert_int_eq(c.headers, 1);
    ck_assert_int_eq(c.comments, 1);
    /* the callback's own error, with its line */
    c = (counter){0, 0, 0, 4, 0};
    ck_assert_int_eq(vl_csv_scan_buffer(text, strlen(text), LABEL, NULL, count, &c, &st),
                     VL_ERR_INPUT);
    ck_assert_int_eq(st.line, 4);
    ck_assert_str_eq(st.msg, "row refused");
    /* a table that stops after one row, from memory and from a file */
    vl_csv_options o = {0, 0, 0, 1, NULL, NULL};
    vl_csv_table *t = parse_ok(text, &o);
    ck_assert_uint_eq(t->nrows, 1);
    ck_assert_int_eq(t->stopped, 1);
    char dir[256], path[512];
    vl_test_tmp_make(dir, sizeof dir, "volev-csv");
    write_file(dir, "s.csv", text, strlen(text), path, sizeof path);
    vl_csv_table *f = vl_csv_read(path, &o, &st);
    ck_assert_msg(f != NULL, "%s", st.msg);
    assert_same(t, f);
    ck_assert_int_eq(f->stopped, 1);
    vl_csv_free(f);
    vl_csv_free(t);
    vl_test_tmp_remove(dir);
}
END_TEST

/* A large table: every row kept, in order, with its line (memory grows linearly). */
START_TEST(test_many_rows)
{
    size_t n = 100000;
    char *text = malloc(24 * (n + 1));
    ck_assert_ptr_nonnull(text);
    size_t used = (size_t)sprintf(text, "i,sq\n");
    for (size_t i = 0; i < n; i++)
        used += (size_t)sprintf(text + used, "%zu,%zu\n", i, i * i);
    vl_status st;
    vl_csv_table *t = vl_csv_parse(text, used, LABEL, NULL, &st);
    ck_assert_msg(t != NULL, "%s", st.msg);
    ck_assert_uint_eq(t->nrows, n);
    /* row i holds i and i*i on line i + 2 (the text built above) */
    ck_assert_str_eq(t->rows[n - 1].field[0], "99999");
    ck_assert_str_eq(t->rows[n - 1].field[1], "9999800001");
    ck_assert_int_eq(t->rows[n - 1].line, (int)n + 1);
    vl_csv_free(t);
    free(text);
}
END_TEST

Suite *vl_suite_csv(void)
{
    Suite *s = suite_create("csv");
    TCase *tc = tcase_create("core");
    tcase_add_test(tc, test_comments);
    tcase_add_test(tc, test_header_lookup);
    tcase_add_test(tc, test_quotes);
    tcase_add_test(tc, test_rest);
    tcase_add_test(tc, test_field_counts);
    tcase_add_test(tc, test_bom);
    tcase_add_test(tc, test_empty_and_header_only);
    tcase_add_test(tc, test_not_regular);
    tcase_add_test(tc, test_size_limit);
    tcase_add_test(tc, test_line_limit);
    tcase_add_test(tc, test_binary);
    tcase_add_test(tc, test_scan_and_stop);
    tcase_add_test(tc, test_many_rows);
    suite_add_tcase(s, tc);
    return s;
}
