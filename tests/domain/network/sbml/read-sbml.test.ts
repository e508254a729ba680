import { describe, expect, it } from "vitest";
import { formatRational } from "../../../../domain/algebra/rational";
import { readSbml } from "../../../../domain/network/sbml/index";
import { networkSignature } from "./network-signature";

const L2V4 = (body: string, extra = "") => `<?xml version="1.0" encoding="UTF-8"?>
<sbml xmlns="http://www.sbml.org/sbml/level2/version4" level="2" version="4">
  <model id="pond">
    <listOfCompartments>
      <compartment id="pond" size="2"/>
    </listOfCompartments>
    <listOfSpecies>
      <species id="Alga" compartment="pond" initialAmount="3"/>
      <species id="Grazer" compartment="pond" initialConcentration="0.25"/>
      <species id="Spare" compartment="pond" initialConcentration="1"/>
    </listOfSpecies>${extra}
    <listOfReactions>
${body}
    </listOfReactions>
  </model>
</sbml>
`;

const GRAZING = `      <reaction id="graze" name="grazing">
        <listOfReactants>
          <speciesReference species="Alga"/>
          <speciesReference species="Grazer"/>
        </listOfReactants>
        <listOfProducts>
          <speciesReference species="Grazer" stoichiometry="2"/>
        </listOfProducts>
        <kineticLaw>
          <math xmlns="http://www.w3.org/1998/Math/MathML">
            <apply><times/><ci> pond </ci><ci> k </ci><ci> Alga </ci><ci> Grazer </ci></apply>
          </math>
          <listOfParameters><parameter id="k" value="0.5"/></listOfParameters>
        </kineticLaw>
      </reaction>`;

describe("readSbml", () => {
  it("reads a Level 2 Version 4 mass-action model with local parameters, the volume factor and initial amounts", () => {
    const r = readSbml(L2V4(GRAZING));
    expect(r.problems).toEqual([]);
    expect(r.level).toBe(2);
    expect(r.version).toBe(4);
    expect(networkSignature(r.network!).reactions).toEqual(["Alga + Grazer -> 2Grazer @k=1/2"]);
    expect(r.network!.rows[0].label).toBe("grazing");
    // initialAmount 3 in a compartment of size 2 is the concentration 3/2, exactly.
    expect(formatRational(r.initial.get("Alga")!)).toBe("3/2");
    expect(formatRational(r.initial.get("Grazer")!)).toBe("1/4");
    expect(r.notes.join("\n")).toMatch(/left out: Spare/);
    // Level 2 marks reactions reversible by default; a one-term law is read as irreversible, and said so.
    expect(r.notes.join("\n")).toMatch(/graze is marked reversible/);
  });

  it("reads a reversible Level 3 law as the difference of two mass-action terms", () => {
    const text = `<?xml version="1.0"?>
<sbml xmlns="http://www.sbml.org/sbml/level3/version1/core" level="3" version="1">
  <model>
    <listOfCompartments><compartment id="v" size="1" constant="true"/></listOfCompartments>
    <listOfSpecies>
      <species id="A" compartment="v" hasOnlySubstanceUnits="false" boundaryCondition="false" constant="false"/>
      <species id="B" compartment="v" hasOnlySubstanceUnits="false" boundaryCondition="false" constant="false"/>
    </listOfSpecies>
    <listOfParameters><parameter id="kf" value="2e-3" constant="true"/><parameter id="kr" constant="true"/></listOfParameters>
    <listOfReactions>
      <reaction id="dimer" reversible="true">
        <listOfReactants><speciesReference species="A" stoichiometry="2" constant="true"/></listOfReactants>
        <listOfProducts><speciesReference species="B" stoichiometry="1" constant="true"/></listOfProducts>
        <kineticLaw><math xmlns="http://www.w3.org/1998/Math/MathML">
          <apply><minus/>
            <apply><times/><ci>kf</ci><apply><power/><ci>A</ci><cn type="integer">2</cn></apply></apply>
            <apply><times/><ci>kr</ci><ci>B</ci></apply>
          </apply></math></kineticLaw>
      </reaction>
    </listOfReactions>
  </model>
</sbml>`;
    const r = readSbml(text);
    expect(r.problems).toEqual([]);
    expect(r.csv).toBe("reaction,label,rate,reverse_rate,rate_value\n2A <-> B,dimer,kf,kr,1/500\n");
    expect(networkSignature(r.network!).reactions).toEqual(["2A -> B @kf=1/500", "B -> 2A @kr=?"]);
  });

  it("refuses a Michaelis–Menten law with the reaction's id and line, and still reports the other reactions", () => {
    const mm = `      <reaction id="uptake" reversible="false">
        <listOfReactants><speciesReference species="Alga"/></listOfReactants>
        <kineticLaw><math xmlns="http://www.w3.org/1998/Math/MathML">
          <apply><divide/><apply><times/><ci>V</ci><ci>Alga</ci></apply><apply><plus/><ci>Km</ci><ci>Alga</ci></apply></apply>
        </math>
        <listOfParameters><parameter id="V" value="1"/><parameter id="Km" value="1"/></listOfParameters></kineticLaw>
      </reaction>`;
    const text = L2V4(`${GRAZING}\n${mm}`);
    const r = readSbml(text);
    expect(r.network).toBeUndefined();
    expect(r.problems).toHaveLength(1);
    const p = r.problems[0];
    expect(p.id).toBe("uptake");
    expect(p.element).toBe("reaction");
    expect(text.split("\n")[p.row - 1]).toContain("<math");
    expect(p.message).toMatch(/<reaction id="uptake">: the kinetic law is not mass action: it divides by a sum/);
    expect(r.reactions.map((x) => [x.id, x.status])).toEqual([
      ["graze", "read"],
      ["uptake", "refused"],
    ]);
  });

  it("refuses non-integer stoichiometry, fixed species, rules and unknown names, each located", () => {
    const text = L2V4(
      `      <reaction id="half" reversible="false">
        <listOfReactants><speciesReference species="Alga" stoichiometry="0.5"/></listOfReactants>
        <kineticLaw><math xmlns="http://www.w3.org/1998/Math/MathML"><apply><times/><ci>q</ci><ci>Alga</ci></apply></math></kineticLaw>
      </reaction>
      <reaction id="ghost" reversible="false">
        <listOfReactants><speciesReference species="Grazer"/></listOfReactants>
        <kineticLaw><math xmlns="http://www.w3.org/1998/Math/MathML"><apply><times/><ci>nobody</ci><ci>Grazer</ci></apply></math></kineticLaw>
      </reaction>`,
      `
    <listOfParameters><parameter id="q" value="1"/></listOfParameters>
    <listOfRules><assignmentRule variable="q"><math xmlns="http://www.w3.org/1998/Math/MathML"><cn>2</cn></math></assignmentRule><rateRule variable="Spare"><math xmlns="http://www.w3.org/1998/Math/MathML"><cn>1</cn></math></rateRule></listOfRules>`,
    ).replace('<species id="Spare" compartment="pond" initialConcentration="1"/>', '<species id="Spare" compartment="pond" boundaryCondition="true"/>');
    const r = readSbml(text);
    const lines = text.split("\n");
    const byId = (id: string) => r.problems.find((p) => p.id === id)!;
    expect(byId("half").message).toMatch(/stoichiometry 0\.5 of `Alga` is not a whole number/);
    expect(lines[byId("half").row - 1]).toContain('stoichiometry="0.5"');
    // A boundary species that a rule moves is out of scope: located at the species, naming its id.
    expect(byId("Spare").message).toMatch(/^<species id="Spare">: species `Spare` is a boundary species \(boundaryCondition="true", constant="false"\) whose value the rateRule on line \d+ sets/);
    expect(lines[byId("Spare").row - 1]).toContain('<species id="Spare"');
    expect(byId("q").message).toMatch(/assignmentRule for `q`/);
    expect(byId("ghost").message).toMatch(/names `nobody`, which is not a species, compartment or parameter/);
    expect(r.network).toBeUndefined();
  });

  it("reads boundary and constant species as constant species, held at their initial value or symbolic", () => {
    const feed = `      <reaction id="feed" reversible="false">
        <listOfReactants><speciesReference species="Spare"/></listOfReactants>
        <listOfProducts><speciesReference species="Alga"/></listOfProducts>
        <kineticLaw><math xmlns="http://www.w3.org/1998/Math/MathML"><apply><times/><ci>pond</ci><ci>kf</ci><ci>Spare</ci></apply></math></kineticLaw>
      </reaction>
      <reaction id="light" reversible="false">
        <listOfReactants><speciesReference species="Sun"/><speciesReference species="Alga"/></listOfReactants>
        <listOfProducts><speciesReference species="Sun"/><speciesReference species="Alga" stoichiometry="2"/></listOfProducts>
        <kineticLaw><math xmlns="http://www.w3.org/1998/Math/MathML"><apply><times/><ci>pond</ci><ci>kl</ci><ci>Sun</ci><ci>Alga</ci></apply></math></kineticLaw>
      </reaction>`;
    const text = L2V4(`${GRAZING}\n${feed}`, `\n    <listOfParameters><parameter id="kf" value="2"/><parameter id="kl"/></listOfParameters>`)
      // Spare: boundary (no rules), held at its concentration 1; Sun: constant="true" without a value, symbolic.
      .replace('<species id="Spare" compartment="pond" initialConcentration="1"/>', '<species id="Spare" compartment="pond" initialConcentration="1" boundaryCondition="true"/>\n      <species id="Sun" compartment="pond" boundaryCondition="true" constant="true"/>');
    const r = readSbml(text);
    expect(r.problems).toEqual([]);
    expect(r.network!.species).toEqual(["Alga", "Grazer"]);
    expect(r.network!.constants?.map((c) => [c.name, c.value ? formatRational(c.value) : null])).toEqual([
      ["Spare", "1"],
      ["Sun", null],
    ]);
    expect(networkSignature(r.network!).reactions).toEqual(["Alga + Grazer -> 2Grazer @k=1/2", "0 -> Alga held Spare @kf=2", "Alga -> 2Alga held Sun @kl=?"]);
    // Initial values of the other species: Alga's amount 3 in a pond of size 2, Grazer's concentration.
    expect(r.csv).toMatch(/\n# constant: Spare = 1, Sun\n# initial: Alga = 3\/2, Grazer = 1\/4\n$/);
    expect(r.network!.initial?.map((i) => [i.name, formatRational(i.value)])).toEqual([
      ["Alga", "3/2"],
      ["Grazer", "1/4"],
    ]);
  });

  it("refuses a species held fixed at 0, located at the species", () => {
    const feed = `<reaction id="feed" reversible="false"><listOfReactants><speciesReference species="Spare"/></listOfReactants><listOfProducts><speciesReference species="Alga"/></listOfProducts>
<kineticLaw><math xmlns="http://www.w3.org/1998/Math/MathML"><apply><times/><ci>pond</ci><ci>kf</ci><ci>Spare</ci></apply></math><listOfParameters><parameter id="kf" value="1"/></listOfParameters></kineticLaw></reaction>`;
    const text = L2V4(feed).replace('<species id="Spare" compartment="pond" initialConcentration="1"/>', '<species id="Spare" compartment="pond" initialConcentration="0" constant="true" boundaryCondition="true"/>');
    const r = readSbml(text);
    expect(r.network).toBeUndefined();
    expect(r.problems.map((p) => [p.element, p.id, p.message])).toEqual([["species", "Spare", expect.stringMatching(/held fixed at 0/)]]);
    expect(text.split("\n")[r.problems[0].row - 1]).toContain('<species id="Spare"');
  });

  it("reports malformed XML with its line and refuses Level 1", () => {
    const r = readSbml('<?xml version="1.0"?>\n<sbml level="2" version="4">\n<model>\n</sbml>\n');
    expect(r.problems[0].row).toBe(4);
    expect(r.problems[0].message).toMatch(/not well-formed XML/);
    expect(readSbml('<sbml level="1" version="2"><model/></sbml>').problems[0].message).toMatch(/Level 1 Version 2 is not read/);
    expect(readSbml("<html/>").problems[0].message).toMatch(/root element is <html>/);
  });

  it("gives a local parameter that shadows another reaction's its own name, and says so", () => {
    const law = (s: string) =>
      `<kineticLaw><math xmlns="http://www.w3.org/1998/Math/MathML"><apply><times/><ci>pond</ci><ci>k</ci><ci>${s}</ci></apply></math><listOfParameters><parameter id="k" value="${s === "Alga" ? 1 : 2}"/></listOfParameters></kineticLaw>`;
    const text = L2V4(`<reaction id="die" reversible="false"><listOfReactants><speciesReference species="Alga"/></listOfReactants>${law("Alga")}</reaction>
<reaction id="starve" reversible="false"><listOfReactants><speciesReference species="Grazer"/></listOfReactants>${law("Grazer")}</reaction>`);
    const r = readSbml(text);
    expect(r.problems).toEqual([]);
    expect(networkSignature(r.network!).reactions).toEqual(["Alga -> 0 @k=1", "Grazer -> 0 @k_starve=2"]);
    expect(r.notes.join("\n")).toMatch(/local parameter k of reaction starve is named k_starve/);
  });

  it("refuses a law without the volume factor when the compartment's size is not 1", () => {
    const text = L2V4(GRAZING.replace("<ci> pond </ci>", ""));
    const r = readSbml(text);
    expect(r.problems[0].id).toBe("graze");
    expect(r.problems[0].message).toMatch(/no volume factor and compartment `pond` has size 2/);
  });

  it("reads shared rate symbols with the CSV rules: a global parameter used twice is one constant", () => {
    const rx = (id: string, s: string) =>
      `<reaction id="${id}" reversible="false"><listOfReactants><speciesReference species="${s}"/></listOfReactants><kineticLaw><math xmlns="http://www.w3.org/1998/Math/MathML"><apply><times/><ci>pond</ci><ci>d</ci><ci>${s}</ci></apply></math></kineticLaw></reaction>`;
    const r = readSbml(L2V4(`${rx("a", "Alga")}\n${rx("b", "Grazer")}`, `\n<listOfParameters><parameter id="d" value="3"/></listOfParameters>`));
    expect(networkSignature(r.network!).reactions).toEqual(["Alga -> 0 @d=3", "Grazer -> 0 @d=3"]);
  });
});

describe("readSbml on hostile input", () => {
  it("reports MathML nested beyond the parser's depth limit instead of crashing", () => {
    const deep = "<apply><plus/>".repeat(150) + "<ci>k</ci>" + "</apply>".repeat(150);
    const text = `<sbml level="3" version="2"><model><listOfReactions><reaction id="r"><kineticLaw><math>${deep}</math></kineticLaw></reaction></listOfReactions></model></sbml>`;
    const r = readSbml(text);
    expect(r.network).toBeUndefined();
    expect(r.problems[0].message).toMatch(/cannot be read as XML: Maximum nested tags exceeded/);
  });

  it("does not expand a chain of entities without bound", () => {
    const ents = ['<!ENTITY a0 "xxxxxxxxxx">', ...Array.from({ length: 9 }, (_, i) => `<!ENTITY a${i + 1} "${`&a${i};`.repeat(10)}">`)].join("");
    const r = readSbml(`<?xml version="1.0"?><!DOCTYPE sbml [${ents}]><sbml level="3" version="2"><model name="&a9;"/></sbml>`);
    // 10^10 characters if expanded; fast-xml-parser leaves the reference unexpanded.
    expect(r.modelName!.length).toBeLessThan(1000);
    expect(r.network).toBeUndefined();
    expect(r.problems.length).toBeGreaterThan(0);
  });
});
