package com.stagewise.ui.drawing;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestStage;
import com.stagewise.ui.drawing.Sheet.PartGlyph;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The schematic's touch targets: every net by its wires, every part lead by the stub from its
 * terminal to the body, named as the readings contract names leads (DESIGN.md: a junction's nets
 * are [anode, cathode], a trimmer's [end, wiper, end]).
 */
class SchematicTargetsTest {
  private static final Stage STAGE =
      TestStage.splitSupply(15)
          .input("IN", 1)
          .r("R1", 10e3, "IN", "SUM")
          .r("R2", 47e3, "SUM", "OUT")
          .part(Part.diode("D1", DiodeClass.SILICON, "OUT", "RECT"))
          .part(Part.trimmer("RV1", 10e3, 0.2, "RECT", "WIPE", "GND", 0.5))
          .r("R3", 10e3, "WIPE", "GND")
          .amp("U1A", "GND", "SUM", "OUT")
          .build();

  @Test
  void everyLeadAndNet_hasATarget_andEachLeadTouchesItsOwnNet() {
    Sheet sheet = SchematicLayout.layout(STAGE, SchematicLayout.APPROXIMATE);
    List<SchematicTargets.Target> targets = SchematicTargets.of(sheet);
    assertThat(targets)
        .extracting(SchematicTargets.Target::point)
        .contains("R1.1", "R1.2", "D1.a", "D1.k", "RV1.1", "RV1.w", "RV1.2", "SUM", "OUT");
    // The anode's stub starts at the glyph's terminal on the anode's net, the cathode's likewise.
    for (PartGlyph g : sheet.parts()) {
      for (SchematicTargets.Target t : targets) {
        if (!t.point().startsWith(g.part().ref() + ".") || t.point().endsWith(".w")) {
          continue;
        }
        String lead = t.point().substring(g.part().ref().length() + 1);
        String net = g.part().leadNet(lead);
        boolean atFirst = t.x1() == g.x1() && t.y1() == g.y1();
        String netThere = atFirst == g.firstAtStart() ? g.part().netA() : g.part().netB();
        assertThat(net).as(t.point()).isEqualTo(netThere);
      }
    }
  }
}
