package com.stagewise.reference;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Reading ngspice's printed output. The sample lines are as ngspice 39 (Debian package) prints them
 * after {@code set numdgt=15}, {@code op}, {@code print all}, {@code ac lin 1 1000 1000}, {@code
 * print all}; the suite runs in a decimal-comma locale, which must not matter.
 */
class NgspiceParseTest {
  private static final String OUTPUT =
      String.join(
          "\n",
          "Circuit: test inverting",
          "@@op",
          "No. of Data Rows : 1",
          "a1#branch_1_0 = 9.979765277196018e-05",
          "n2 = 1.500000000000000e+01",
          "n5 = 1.023472280453200e-03",
          "n6 = -4.68946620800142e+00",
          "@@ac",
          "n2 = 0.000000000000000e+00,0.000000000000000e+00",
          "n5 = 2.163946690998504e-06,-6.38281198460304e-07",
          "n6 = -4.32289349019434e-01,1.276562428834668e-01",
          "@@end",
          "ngspice-39 done",
          "@@stderr",
          "n6 = 1.0e+00",
          "Note: No compatibility mode selected!");

  private static final Map<String, String> NODES =
      Map.of("GND", "0", "VCC", "n2", "SUM", "n5", "OUT", "n6");

  @Test
  void parse_readsDcAndAcPerNode_ignoringStderr() {
    Ngspice.Outcome outcome = Ngspice.parse(OUTPUT, NODES);
    assertThat(outcome).isInstanceOf(Ngspice.Solved.class);
    Ngspice.Solved solved = (Ngspice.Solved) outcome;
    assertThat(solved.dc()).containsEntry("OUT", -4.68946620800142).containsEntry("GND", 0.0);
    assertThat(solved.acAmplitude("OUT"))
        .isCloseTo(0.4507440489044408, org.assertj.core.data.Offset.offset(1e-15));
    // ngspice prints vp(n6) = 2.854450794666344 rad for this node: 163.5467°.
    assertThat(solved.acPhaseDegrees("OUT"))
        .isCloseTo(Math.toDegrees(2.854450794666344), org.assertj.core.data.Offset.offset(1e-9));
  }

  @Test
  void parse_missingNode_isAFailureWithNgspicesLastLines() {
    String failed = "@@op\nError: no such vector n6\nop simulation(s) aborted\n@@end\n@@stderr\n";
    assertThat(Ngspice.parse(failed, NODES)).isInstanceOf(Ngspice.Failed.class);
  }

  @Test
  void num_writesAPointAndExponent_whateverTheLocale() {
    assertThat(SpiceNetlist.num(-4.7e-3)).isEqualTo("-4.700000000000000e-03");
  }
}
