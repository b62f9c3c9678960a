// Tests of data/elements.csv, data/aliases.csv and their reader (engine/src/tables.cpp).
#include <catch2/catch.hpp>

#include "nasa.hpp"
#include "tables.hpp"

#include <cmath>
#include <cstdio>
#include <map>
#include <set>
#include <sstream>
#include <stdexcept>
#include <string>

using namespace rxnheat::detail;

namespace {

const std::vector<Element>& elements() {
    static const std::vector<Element> e = parse_elements_csv(embedded_elements_csv());
    return e;
}
const std::vector<Alias>& aliases() {
    static const std::vector<Alias> a = parse_aliases_csv(embedded_aliases_csv());
    return a;
}
const std::vector<Record>& records() {
    static const std::vector<Record> r = parse_nasa_glenn(embedded_thermo_inp());
    return r;
}
const Record* record(const std::string& name) {
    for (const Record& r : records())
        if (r.name == name) return &r;
    return nullptr;
}
const Alias* alias(const std::string& name) {
    for (const Alias& a : aliases())
        if (a.name == name) return &a;
    return nullptr;
}

template <class F>
void expect_error(F&& parse, const std::string& text, const std::string& prefix, const std::string& what) {
    try {
        parse(text);
        FAIL("no error; expected " << prefix << " " << what);
    } catch (const std::runtime_error& e) {
        const std::string msg = e.what();
        INFO(msg);
        CHECK(msg.rfind(prefix, 0) == 0);
        CHECK(msg.find(what) != std::string::npos);
    }
}

}  // namespace

TEST_CASE("elements.csv parses and covers H to Pu and the NASA file", "[tables]") {
    const auto& es = elements();
    std::map<int, std::string> by_z;
    std::set<std::string> symbols;
    for (const Element& e : es) {
        symbols.insert(e.symbol);
        if (e.symbol == "D") continue;  // deuterium: an isotope, z = 1
        INFO(e.symbol);
        CHECK(by_z.emplace(e.z, e.symbol).second);
    }
    for (int z = 1; z <= 94; ++z) {
        INFO("z = " << z);
        CHECK(by_z.count(z) == 1);
    }
    CHECK(es.size() == 95);
    // Every element symbol of thermo.inp's element fields is in elements.csv, except the file's
    // dummy "UA" (undissociated NH3).
    std::set<std::string> missing;
    for (const Record& r : records())
        for (auto& [s, c] : r.elements)
            if (!symbols.count(s)) missing.insert(s);
    CHECK(missing == std::set<std::string>{"Ua"});
    // A few values as printed in elements.csv (IUPAC/CIAAW conventional values).
    std::map<std::string, const Element*> m;
    for (const Element& e : es) m[e.symbol] = &e;
    CHECK(m["C"]->weight == 12.011);
    CHECK(m["Cl"]->name == "chlorine");
    CHECK(m["D"]->z == 1);
    CHECK(m["D"]->weight == Approx(2.01410).margin(1e-5));
    CHECK(m["Pu"]->z == 94);
}

TEST_CASE("elements.csv weights agree with python3-periodictable", "[tables][external]") {
    // Outside source: Debian's python3-periodictable (IUPAC atomic weights of an older edition),
    // run at test time with the system interpreter. Tolerance 1e-3 relative: IUPAC editions differ
    // by up to about 5e-4 (zinc 65.409 -> 65.38); radioactive elements carry mass numbers in both.
    const char* cmd =
        "/usr/bin/python3 -c \"import periodictable as pt\n"
        "for e in pt.elements:\n"
        "    print(e.symbol, e.number, repr(float(e.mass)))\n"
        "print('D', 1, repr(float(pt.D.mass)))\" 2>&1";
    FILE* p = popen(cmd, "r");
    REQUIRE(p != nullptr);
    std::string out;
    char buf[4096];
    while (std::size_t n = std::fread(buf, 1, sizeof buf, p)) out.append(buf, n);
    const int status = pclose(p);
    INFO(out.substr(0, 400));
    REQUIRE(status == 0);
    std::map<std::string, std::pair<int, double>> ref;
    std::istringstream in(out);
    std::string sym;
    int z;
    double mass;
    while (in >> sym >> z >> mass) ref[sym] = {z, mass};
    REQUIRE(ref.size() > 100);
    double worst = 0;
    std::string worst_sym;
    for (const Element& e : elements()) {
        INFO(e.symbol);
        REQUIRE(ref.count(e.symbol) == 1);
        CHECK(ref[e.symbol].first == e.z);
        const double rel = std::fabs(e.weight - ref[e.symbol].second) / ref[e.symbol].second;
        CHECK(rel < 1e-3);
        if (rel > worst) { worst = rel; worst_sym = e.symbol; }
    }
    WARN("elements.csv vs python3-periodictable: worst relative difference " << worst << " (" << worst_sym
                                                                            << ")");
}

TEST_CASE("aliases.csv parses, and every record it names exists with the right phase", "[tables]") {
    const auto& as = aliases();
    CHECK(as.size() > 100);
    std::size_t names_checked = 0;
    for (const Alias& a : as) {
        INFO(a.name);
        CHECK(valid_alias_name(a.name));
        auto check = [&](const std::string& n, PhaseKind want) {
            const Record* r = record(n);
            INFO(n);
            REQUIRE(r != nullptr);
            CHECK(r->phase == want);
            ++names_checked;
        };
        if (!a.gas.empty()) check(a.gas, PhaseKind::gas);
        if (!a.liquid.empty()) check(a.liquid, PhaseKind::liquid);
        for (const std::string& s : a.solid) check(s, PhaseKind::solid);
        // Polymorphs listed for a solid have adjacent, non-overlapping ranges.
        for (std::size_t i = 0; i < a.solid.size(); ++i)
            for (std::size_t j = i + 1; j < a.solid.size(); ++j) {
                const Record* x = record(a.solid[i]);
                const Record* y = record(a.solid[j]);
                if (x && y) CHECK((x->tmax() <= y->tmin() || y->tmax() <= x->tmin()));
            }
    }
    WARN(as.size() << " aliases naming " << names_checked << " records");
    // The aliases the specification names.
    const Alias* eth = alias("ethanol");
    REQUIRE(eth);
    CHECK(eth->gas == "C2H5OH");
    CHECK(eth->liquid == "C2H5OH(L)");
    CHECK(eth->solid.empty());
    REQUIRE(alias("n-octane"));
    CHECK(alias("n-octane")->gas == "C8H18,n-octane");
    REQUIRE(alias("isooctane"));
    CHECK(alias("isooctane")->liquid == "C8H18(L),isooct");
    REQUIRE(alias("propylene"));
    CHECK(alias("propylene")->gas == "C3H6,propylene");
    REQUIRE(alias("cyclopropane"));
    CHECK(alias("cyclopropane")->gas == "C3H6,cyclo-");
    REQUIRE(alias("ethylene oxide"));
    CHECK(alias("ethylene oxide")->gas == "C2H4O,ethylen-o");
    REQUIRE(alias("iron"));
    CHECK(alias("iron")->solid == std::vector<std::string>{"Fe(a)", "Fe(c)", "Fe(d)"});
    REQUIRE(alias("water"));
    CHECK(alias("water")->liquid == "H2O(L)");
    for (const char* n : {"methanol", "acetone", "n-heptane", "benzene", "toluene", "ethylene", "ethane", "propane",
                          "n-butane", "isobutane", "dimethyl ether", "methane", "hydrogen", "oxygen", "nitrogen",
                          "ammonia", "carbon dioxide", "carbon monoxide", "sulfur dioxide", "sulfur trioxide",
                          "hydrogen sulfide", "graphite", "lime", "limestone", "calcite", "slaked lime", "hematite",
                          "magnetite", "wustite", "sulfur"}) {
        INFO(n);
        CHECK(alias(n) != nullptr);
    }
    CHECK(alias("steam") == nullptr);  // the phase decides: water(g)
}

TEST_CASE("malformed elements.csv: errors name the line and the column", "[tables]") {
    auto parse = [](const std::string& t) { parse_elements_csv(t); };
    const std::string hdr = "# comment\nsymbol,z,name,weight,note\n";  // data starts on line 3
    CHECK(parse_elements_csv(hdr + "H,1,hydrogen,1.008,\n\"He\",2,\"helium, noble\",4.002602\n").size() == 2);
    CHECK(parse_elements_csv(hdr + "He,2,\"helium, noble\",4.002602\n")[0].name == "helium, noble");
    CHECK(parse_elements_csv("symbol,z,name,weight\r\nH,1,hydrogen,1.008\r\n")[0].weight == 1.008);
    expect_error(parse, "", "elements.csv line 1: ", "no header row");
    expect_error(parse, "# only\n", "elements.csv line 2: ", "no header row");
    expect_error(parse, "symbol,z,name\nH,1,hydrogen\n", "elements.csv line 1: ", "lacks the column 'weight'");
    expect_error(parse, "symbol,z,name,weight,mass\n", "elements.csv line 1: ", "unknown column 'mass'");
    expect_error(parse, "symbol,z,name,weight\n", "elements.csv line 1: ", "no element rows");
    expect_error(parse, hdr + "H,1,hydrogen,1.008\nHe,2,helium,four\n", "elements.csv line 4: ", "column 'weight'");
    expect_error(parse, hdr + "H,1,hydrogen,-1\n", "elements.csv line 3: ", "column 'weight'");
    expect_error(parse, hdr + "H,one,hydrogen,1.008\n", "elements.csv line 3: ", "column 'z'");
    expect_error(parse, hdr + "H,0,hydrogen,1.008\n", "elements.csv line 3: ", "column 'z'");
    expect_error(parse, hdr + "HE,2,helium,4.0026\n", "elements.csv line 3: ", "column 'symbol'");
    expect_error(parse, hdr + "H,1,,1.008\n", "elements.csv line 3: ", "column 'name'");
    expect_error(parse, hdr + "H,1,hydrogen,1.008\nH,1,hydrogen,1.008\n", "elements.csv line 4: ", "repeats line 3");
    expect_error(parse, hdr + "H,1,\"hydrogen,1.008\n", "elements.csv line 3: ", "not closed");
    expect_error(parse, hdr + "H,1,\"hy\"drogen,1.008\n", "elements.csv line 3: ", "after the closing quote");
    expect_error(parse, hdr + "H,1,hy\"drogen,1.008\n", "elements.csv line 3: ", "inside the unquoted field");
    expect_error(parse, hdr + "H,1,hydrogen,1.008,,extra\n", "elements.csv line 3: ", "6 fields, but the header has 5");
}

TEST_CASE("malformed aliases.csv: errors name the line and the column", "[tables]") {
    auto parse = [](const std::string& t) { parse_aliases_csv(t); };
    const std::string hdr = "name,gas,liquid,solid,note\n";  // data starts on line 2
    auto a = parse_aliases_csv(hdr + "iron,Fe,Fe(L), Fe(a) | Fe(c) ,\n\"ethylene oxide\",\"C2H4O,ethylen-o\",,,\"x, y\"\n");
    REQUIRE(a.size() == 2);
    CHECK(a[0].solid == std::vector<std::string>{"Fe(a)", "Fe(c)"});
    CHECK(a[1].gas == "C2H4O,ethylen-o");
    CHECK(a[1].solid.empty());
    expect_error(parse, "name,gas,liquid\n", "aliases.csv line 1: ", "lacks the column 'solid'");
    expect_error(parse, hdr + "Ethanol,C2H5OH,,,\n", "aliases.csv line 2: ", "column 'name'");
    expect_error(parse, hdr + "ethyl  alcohol,C2H5OH,,,\n", "aliases.csv line 2: ", "column 'name'");
    CHECK(parse_aliases_csv(hdr + " ethanol ,C2H5OH,,,\n")[0].name == "ethanol");  // fields are trimmed
    expect_error(parse, hdr + "1-butanol,C4H9OH,,,\n", "aliases.csv line 2: ", "column 'name'");
    expect_error(parse, hdr + "eth_anol,C2H5OH,,,\n", "aliases.csv line 2: ", "column 'name'");
    expect_error(parse, hdr + "nothing,,,,\n", "aliases.csv line 2: ", "names no record");
    expect_error(parse, hdr + "iron,,,Fe(a)||Fe(c),\n", "aliases.csv line 2: ", "column 'solid'");
    expect_error(parse, hdr + "iron,,,Fe(a)|Fe(a),\n", "aliases.csv line 2: ", "listed twice");
    expect_error(parse, hdr + "iron,Fe x,,,\n", "aliases.csv line 2: ", "column 'gas'");
    expect_error(parse, hdr + "iron,Fe,,,\n# c\nIRON,Fe,,,\n", "aliases.csv line 4: ", "column 'name'");
    expect_error(parse, hdr + "iron,Fe,,,\niron,Fe,,,\n", "aliases.csv line 3: ", "repeats line 2");
    expect_error(parse, hdr + "iron,\"Fe,,,\n", "aliases.csv line 2: ", "not closed");
}

TEST_CASE("valid_alias_name follows the grammar's name rule", "[tables]") {
    CHECK(valid_alias_name("ethanol"));
    CHECK(valid_alias_name("n-octane"));
    CHECK(valid_alias_name("cis-2-butene"));
    CHECK(valid_alias_name("dimethyl ether"));
    CHECK(valid_alias_name("a,b"));
    CHECK_FALSE(valid_alias_name(""));
    CHECK_FALSE(valid_alias_name("Ethanol"));
    CHECK_FALSE(valid_alias_name("2-butene"));
    CHECK_FALSE(valid_alias_name("-x"));
    CHECK_FALSE(valid_alias_name("a  b"));
    CHECK_FALSE(valid_alias_name("a "));
    CHECK_FALSE(valid_alias_name("a(b)"));
    CHECK_FALSE(valid_alias_name("é"));
}
