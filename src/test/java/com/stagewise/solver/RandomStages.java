package com.stagewise.solver;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestStage;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/** Random op-amp networks for property tests (seeded; the stages mean nothing beyond the test). */
final class RandomStages {
  private static final double[] E12 = {1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2};
  private static final DeviceClass[] CLASSES = DeviceClass.values();

  private RandomStages() {}

  /**
   * Returns a random stage with 1 to 3 sections on ±12 V, 1 or 2 inputs, internal nets N1…N5 and 3
   * to 9 resistors; some have positive feedback, some saturate, some float.
   */
  static Stage next(Random random) {
    TestStage s = TestStage.splitSupply(12);
    int inputs = 1 + random.nextInt(2);
    List<String> nets = new ArrayList<>(List.of("GND"));
    for (int i = 1; i <= inputs; i++) {
      s.input("IN" + i, (random.nextDouble() * 4) - 2);
      nets.add("IN" + i);
    }
    int sections = 1 + random.nextInt(3);
    List<String> internal = new ArrayList<>();
    for (int i = 1; i <= 5; i++) {
      internal.add("N" + i);
    }
    List<String> all = new ArrayList<>(nets);
    all.addAll(internal);
    DeviceClass type = CLASSES[random.nextInt(CLASSES.length)];
    for (int k = 0; k < sections; k++) {
      String out = "O" + (k + 1);
      all.add(out);
    }
    for (int k = 0; k < sections; k++) {
      String out = "O" + (k + 1);
      String inPlus = all.get(random.nextInt(all.size()));
      String inMinus = random.nextInt(4) == 0 ? out : all.get(random.nextInt(all.size()));
      s.amp("U1" + "ABCD".charAt(k), type, inPlus, inMinus, out, "VCC", "VEE");
    }
    int resistors = 3 + random.nextInt(7);
    for (int i = 0; i < resistors; i++) {
      String a = all.get(random.nextInt(all.size()));
      String b = all.get(random.nextInt(all.size()));
      if (a.equals(b)) {
        continue;
      }
      double ohms = E12[random.nextInt(E12.length)] * Math.pow(10, 3 + random.nextInt(3));
      s.r("R" + (i + 1), ohms, a, b);
    }
    return s.build();
  }
}
