package org.cardwright.lot;

import java.nio.file.Files;
import java.nio.file.Path;
import org.cardwright.cli.Main;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

class LotScratchTest {
    @Test
    void run() throws Exception {
        Path dir = Simulators.tempDir("lot-scratch");
        LotGenerator.Lot lot = LotGenerator.write(dir.resolve("in"), Integer.getInteger("lot.n", 40), 11, true, true);
        lot.truth().forEach((k, v) -> System.out.println("truth " + k + " " + v));
        long t0 = System.nanoTime();
        int code = Main.execute("lot", dir.resolve("in").toString(), "--name", "LOTX", "--out", dir.resolve("out").toString());
        System.out.println("exit " + code + " in " + (System.nanoTime() - t0) / 1e9 + " s");
        System.out.println(Files.readString(dir.resolve("out/LOTX.lot.json")));
        System.out.println(Files.readString(dir.resolve("out/LOTX.montecarlo.ngspice.lib")));
        System.out.println(Files.readString(dir.resolve("out/LOTX.vf-low.ngspice.lib")));
    }
}
