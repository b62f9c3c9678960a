/* Uses the installed C ABI: prints ΔrH° of the water-gas shift at 1000 K, then one error; then,
 * through the catalogue call, RXNDH, RXNLOAD with a species table read from the CSV file named
 * by argv[1], MOLARMASS, an unknown unit's status, RXNWHY's words and the list of functions.
 * run_install_test.sh checks each line against its source. */
#include <rxnheat/rxnheat.h>

#include <stdio.h>
#include <string.h>

static int failures = 0;

static void expect_status(const char* what, rxnheat_status got, rxnheat_status want, const char* err) {
    if (got != want) {
        fprintf(stderr, "%s: status %d, want %d: %s\n", what, (int)got, (int)want, err);
        ++failures;
    }
}

int main(int argc, char** argv) {
    char err[512];
    char text[2048];
    double v = 0;
    rxnheat_result res;
    rxnheat_engine* e = rxnheat_open();
    if (!e) return 2;
    if (rxnheat_dh(e, "CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000.0, NULL, NULL, &v, err, sizeof err) != RXNHEAT_OK) {
        fprintf(stderr, "%s\n", err);
        return 3;
    }
    printf("%.2f\n", v);
    rxnheat_status st = rxnheat_dh(e, "CH4(g) -> C(s) + 2 H2(g)", 150.0, NULL, NULL, &v, err, sizeof err);
    printf("status %d: %s\n", (int)st, err);
    if (st != RXNHEAT_E_OUT_OF_RANGE) ++failures;

    /* RXNDH through the catalogue, temperature and unit omitted (their defaults). */
    {
        rxnheat_value args[] = {rxnheat_text("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)")};
        st = rxnheat_call(e, "RXNDH", args, 1, &res, text, sizeof text, err, sizeof err);
        expect_status("RXNDH", st, RXNHEAT_OK, err);
        printf("call dh: %.2f %s\n", res.number, res.unit);
    }
    /* RXNLOAD with a table handle: 2 mol of a species only the table knows. */
    if (argc > 1) {
        rxnheat_table* table = NULL;
        st = rxnheat_table_from_csv(argv[1], &table, err, sizeof err);
        expect_status("rxnheat_table_from_csv", st, RXNHEAT_OK, err);
        rxnheat_value args[] = {rxnheat_text("Xe(g) + 3 F2(g) -> XeF6(g)"), rxnheat_number(2), rxnheat_text("mol"),
                                rxnheat_text("XeF6(g)"), rxnheat_omitted(), rxnheat_omitted(),
                                rxnheat_table_value(table)};
        st = rxnheat_call(e, "RXNLOAD", args, 7, &res, text, sizeof text, err, sizeof err);
        expect_status("RXNLOAD with the table", st, RXNHEAT_OK, err);
        printf("call load: %.6f %s\n", res.number, res.unit);
        st = rxnheat_call(e, "RXNLOAD", args, 6, &res, text, sizeof text, err, sizeof err);
        printf("call load without the table: status %d: %s\n", (int)st, err);
        rxnheat_table_close(table);
    }
    /* MOLARMASS of a hydrate. */
    {
        rxnheat_value args[] = {rxnheat_text("CuSO4·5H2O")};
        st = rxnheat_call(e, "MOLARMASS", args, 1, &res, text, sizeof text, err, sizeof err);
        expect_status("MOLARMASS", st, RXNHEAT_OK, err);
        printf("call molarmass: %.17g %s\n", res.number, res.unit);
    }
    /* An unknown unit: its status and the argument at fault (the third, "unit"). */
    {
        rxnheat_value args[] = {rxnheat_text("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)"), rxnheat_omitted(),
                                rxnheat_text("kg/hr")};
        st = rxnheat_call(e, "RXNDH", args, 3, &res, text, sizeof text, err, sizeof err);
        printf("call unit error: status %d, result kind %d: %s\n", (int)st, res.kind, err);
        /* RXNWHY of the same call, and of a good one. */
        st = rxnheat_why(e, "RXNDH", args, 3, text, sizeof text, err, sizeof err);
        expect_status("rxnheat_why", st, RXNHEAT_OK, err);
        printf("why: %s\n", text);
        st = rxnheat_why(e, "RXNDH", args, 1, text, sizeof text, err, sizeof err);
        expect_status("rxnheat_why (good call)", st, RXNHEAT_OK, err);
        printf("why good: %s\n", text);
    }
    /* The functions a C host can call. */
    {
        size_t i, n = rxnheat_function_count();
        printf("functions %u:", (unsigned)n);
        for (i = 0; i < n; ++i) printf(" %s", rxnheat_function_name(i));
        printf("\n");
        if (rxnheat_function_name(n) != NULL) ++failures;
    }
    rxnheat_close(e);
    return failures == 0 ? 0 : 4;
}
