#!/usr/bin/env python3
"""Writes the seed corpus of fuzz/corpus/ (grammar, engine, table): inputs from the syntax,
the function catalogue and the user-table columns, good and bad. Findings saved by fuzzing are
added to the corpus by hand (fuzz/corpus/*/finding-*) and are kept when this runs again.
The other files (named by their SHA-1) are units that a fuzzing run found new coverage with,
merged in with `fuzz_X -merge=1 fuzz/corpus/X RUN_DIR` (DEVELOPERS.md); this script leaves them.
Run: python3 fuzz/make-seeds.py"""
import hashlib
import pathlib

here = pathlib.Path(__file__).resolve().parent

reactions = [
    "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)",
    "2H2 + O2 = 2H2O",
    "1/2 N2(g) + 3/2 H2(g) → NH3(g)",
    "SO2(g) + 0.5 O2(g) ⇌ SO3(g)",
    "CH₄(g) + 2O₂(g) → CO₂(g) + 2H₂O(l)",
    "CuSO4·5H2O(s) -> CuSO4(s) + 5 H2O(l)",
    "Ca(OH)2(s) + CO2(g) -> CaCO3(s) + H2O(l)",
    "H+(aq) + OH-(aq) -> H2O(l)",
    "Fe^3+(aq) + 3 OH^-(aq) -> Fe(OH)3(s)",
    "ethanol(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)",
    "CO + H2O <=> CO2 + H2",
    "[Cu(NH3)4]SO4 -> CuSO4 + 4 NH3",
    "CaSO4·½H2O(s) + 1½ H2O(l) -> CaSO4·2H2O(s)",
    "SO4{2-}(aq) + Ba{2+}(aq) -> BaSO4(s)",
    "Fe³⁺ + 3 OH⁻ → Fe(OH)₃",
    "n-octane + 12.5 O2 -> 8 CO2 + 9 H2O",
    "ethylene   oxide + H2O -> ethylene glycol",
    "C3H6(g) + H2 -> C3H8(g)",
    "H2O->H2O",
    "OH-->H2O",
    "C2H5OH + O2 -> CO2 + H2O",
    "Fe2O3 + Al -> Al2O3 + Fe",
    "2 NO2 ⟶ N2O4",
    "CH4 + O2 -> CO2 + H2O + H2O",
    "H2(g) + Cl2(g) <-> 2 HCl(g)",
    # errors the grammar names
    "CH4 + + O2 -> CO2",
    "CH4 -> CO2 -> H2O",
    "0 H2 -> H2",
    "Ethanol -> C2H4 + H2O",
    "Ca(OH2 -> CaO + H2O",
    "H2O(x) -> H2O(g)",
    "1234567890123 H2 -> H2",
    "Fe^100+ -> Fe",
    "((((((((((((((((((H)))))))))))))))))) -> H",
    "CH4(g)+2O2(g)->CO2(g)+2H2O(l)\u00a0",
    "\ufeffH2 + O2 -> H2O",
    "H2 + O2 -> H2O\x00",
    "\udcff\udcfe -> H2",
    "",
    "->",
    "H0.9999999 -> H",
]
species = ["CH4(g)", "H2O", "H2O(l)", "Na+(aq)", "ethanol", "CuSO4*5H2O", "Fe(cr)", "SO4^2-",
           "C", "He", "xenon", "Q2", "1/2", "½", "3/0", "0.947", "Hf", "HF", "co", "CO"]
numbers = ["2", "0.5", "1/2", "½", "1½", "3/0", "0", "-1", "1e5", "123456789012", ".5", "5.", "⅞"]


def write(folder, name, text):
    d = here / "corpus" / folder
    d.mkdir(parents=True, exist_ok=True)
    data = text.encode("utf-8", "surrogateescape") if isinstance(text, str) else text
    (d / f"seed-{name}").write_bytes(data)


def h(text):
    return hashlib.sha1(text.encode("utf-8", "surrogateescape")).hexdigest()[:10]


for r in reactions + species + numbers:
    write("grammar", h(r), r)
write("grammar", "long-4096", "H" * 4096)
write("grammar", "long-4097", "H" * 4097)
write("grammar", "many-terms", " + ".join(f"C{i}H{2*i+2}" for i in range(1, 200)) + " -> CO2")

# engine: line 1 the function (and host flags), then one argument per line (fuzz_common.hpp).
table_range = "|formula;phase;dHf;S;cp;name;source|C9H7N3S2;g;-12.5;200;30;quorvane gas;Hallistry Marsh Works demo row"
engine = [
    "RXNDH\nCH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)",
    "RXNDH\nCH4 + 2 O2 -> CO2 + 2 H2O\n350 C\nMJ/kg\nCH4",
    "RXNDH z\nCH4 + 2 O2 -> CO2 + 2 H2O\n=0\n=0",
    "dh t\n2H2 + O2 = 2H2O\n1000\nkcal/mol",
    "RXNDH\nCO + H2O -> CO2 + H2\n=NaN",
    "RXNDH\nCO + H2O -> CO2 + H2\n=1e308",
    "RXNDH\nCO + H2O -> CO2 + H2\n=4.9e-324",
    "RXNDH\nCO + H2O -> CO2 + H2\n-1 K",
    "RXNDH\nCO + H2O -> CO2 + H2\n662 F\nBTU/lbmol",
    "RXNDH\nCO + H2O -> CO2 + H2\n1100 R\nmj/kg",
    "RXNDH\n|CO + H2O -> CO2 + H2;CH4 + 2 O2 -> CO2 + 2 H2O|H2 + Cl2 -> 2 HCl;~\n|300;400;500",
    "RXNDU\nCH4 + 2 O2 -> CO2 + 2 H2O\n500 K\nkJ/kg\nO2",
    "RXNDS\nN2 + 3 H2 -> 2 NH3\n700\ncal/(mol*K)",
    "RXNDG\nN2 + 3 H2 -> 2 NH3\n700\nkJ/mol",
    "RXNLOGK\nN2 + 3 H2 -> 2 NH3\n700 K",
    "RXNLOAD\nCH4 + 2 O2 -> CO2 + 2 H2O\n=1200\nkg/h\nCH4\nMW\n25 C",
    "RXNLOAD\nCH4 + 2 O2 -> CO2 + 2 H2O\n=5\nMMscfd\nCH4",
    "RXNLOAD\nCH4 + 2 O2 -> CO2 + 2 H2O\n=-1e300\nNm3/min\nO2\nkJ",
    "RXNKIND\nH2O(l) -> H2O(g)\n373.15\n=0.5",
    "RXNCHECK\nCH4 + O2 -> CO2 + H2O",
    "RXNCHECK\nC9H7N3S2 -> X + Q2\n\n" + table_range,
    "RXNBALANCE\nC3H8 + O2 -> CO2 + H2O",
    "RXNBALANCE\nKMnO4 + HCl -> KCl + MnCl2 + H2O + Cl2",
    "RXNBALANCE\nH2 + O2 -> H2O + H2O2",
    "RXNREVERSE\nN2 + 3 H2 -> 2 NH3",
    "RXNSCALE\nN2 + 3 H2 -> 2 NH3\n½",
    "RXNSCALE\nN2 + 3 H2 -> 2 NH3\n=1e-7",
    "RXNSCALE\nN2 + 3 H2 -> 2 NH3\n=1e13",
    "RXNWHY\nRXNDH\nCH4 + 2 O2 -> CO2 + 2 H2O\n350 X",
    "RXNWHY\nSPECIESCP\nQ2",
    "SPECIESHF\nCO2(g)\n1000 K\nkcal/mol",
    "SPECIESHF\nC9H7N3S2(g)\n\n\n" + table_range,
    "SPECIESCP\nH2O(g)\n500",
    "SPECIESH\nFe\n1300\n298.15",
    "MOLARMASS\nCuSO4·5H2O",
    "MOLARMASS\n[Cu(NH3)4]SO4(aq)",
    "RXNEQX\nN2 + 3 H2 -> 2 NH3\n700 K\n200 bar\n|N2;=1|H2;=3|Ar;=0.1\nN2",
    "RXNEQX\nCO + H2O -> CO2 + H2\n900\n20 barg\n|CO;=1|H2O;=2",
    "RXNHESS\nC + 2 H2 -> CH4\n|C + O2 -> CO2|H2 + 0.5 O2 -> H2O(l)|CH4 + 2 O2 -> CO2 + 2 H2O(l)\n|=-393.5|=-285.8|=-890.6",
    "RXNHESSPLAN\nC + 2 H2 -> CH4\n|C + O2 -> CO2|H2 + 0.5 O2 -> H2O(l)|CH4 + 2 O2 -> CO2 + 2 H2O(l)",
    "STEAMTSAT\n=10",
    "STEAMTSAT\n10 barg",
    "STEAMPSAT\n=450",
    "STEAMH\n=10\n=500",
    "STEAMH\n=10\n\nvapour",
    "STEAMH\n=220.64\n=647.096",
    "STEAMLATENT\n=1.01325",
    "FUELHV\nCH4\nLHV\nMJ/Nm3",
    "FUELHV\n|CH4;=0.9|C2H6;=0.05|N2;=0.05\nHHV\nBTU/scf",
    "STREAMH\n|CH4;=10|H2O(g);=20\n500 C\nkmol/h\nkW",
    "RXNDUTY\nCH4 + H2O -> CO + 3 H2\n|CH4;=100|H2O(g);=300\n=0.8\nCH4\n=800\n=1100\nkmol/h\nMW",
    "RXNTAD\nCH4 + 2 O2 -> CO2 + 2 H2O(g)\n298.15\n|N2;=7.52\n=1",
    "RXNSOURCE\nCH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)",
    "RXNSOURCE\nH2O\n\n500 K",
    "RXNVERSION",
    "RXNDH\nCH4 + 2 O2 -> CO2 + 2 H2O\n298.15\nkJ/mol\nCH4\n~\nextra",
    "NOSUCH\nx",
]
for e in engine:
    write("engine", h(e), e)

# table: line 1 the reaction or species, line 2 the temperature, then the table as CSV.
header_rows = [
    "formula,phase,dHf\nC9H7N3S2,g,-12.5\n",
    "formula,phase,dHf,S,cp,name,source\nC9H7N3S2,g,-12.5,200,30,quorvane gas,Hallistry Marsh Works demo row\n",
    "phase,formula,dHf,S\ng,C9H7N3S2,-12.5,200\n",
    "formula,phase,dHf,cp,S\nC9H7N3S2,g,-12.5,200,30\n",
    "formula,phase,dHf,a,b,c,d,e,tmin,tmax\nC9H7N3S2,g,-12.5,30,1,0.1,0.01,0.1,200,1500\n",
    "formula,phase,dHf,tmin,tmax\nC9H7N3S2,g,-12.5,200,1500\n",
    "formula,phase,dHf\nC9H7N3S2,g,1e306\n",
    "formula,phase,dHf,a,b,c,d,e,tmin,tmax\nC9H7N3S2,g,0,1e300,1e300,1e300,1e300,1e300,200,6000\n",
    "formula,phase,dHf\nC9H7N3S2(g),g,-12.5\n",
    "formula,phase,dHf\nC9H7N3S2,plasma,-12.5\n",
    "formula,phase,dHf,dHf\nC9H7N3S2,g,-12.5,-13\n",
    "formula,phase\nC9H7N3S2,g\n",
    "formula,phase,dHf\nC9H7N3S2,g,abc\n",
    "formula,phase,dHf\nC9H7N3S2,g,-12.5\nC9H7N3S2,l,-30\n",
    "formula,phase,dHf\n\"C9H7N3S2\",\"g\",\"-12.5\"\n",
    "formula,phase,dHf\nC9H7N3S2,g,\"-12.5\"x\n",
    "formula,phase,dHf\r\nNa+,aq,-240.1\r\n",
    "formula,phase,dHf,name\nCH4,g,-74.6,quorvane marsh gas\n",
    "formula,phase,dHf,cp,a\nC9H7N3S2,g,-12.5,30,30\n",
    "formula,phase,dHf\nXQ2,g,-12.5\n",
]
subjects = [("C9H7N3S2 -> X + Q2", ""), ("C9H7N3S2(g)", "500 K"), ("CH4 + 2 O2 -> CO2 + 2 H2O", "1000"),
            ("quorvane gas", ""), ("Na+(aq) + Cl-(aq) -> NaCl(s)", ""), ("C9H7N3S2", "1e308")]
for i, t in enumerate(header_rows):
    s, temp = subjects[i % len(subjects)]
    text = f"{s}\n{temp}\n{t}"
    write("table", h(text), text)
