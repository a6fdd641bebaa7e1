package com.stagewise.history;

import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import javax.imageio.ImageIO;

/**
 * Small pictures for tests, written by the JDK's own image writers (javax.imageio), so that what
 * the program reads from them is checked against an encoder outside the project.
 */
public final class TestPictures {
  private TestPictures() {}

  /** Returns a PNG of {@code width} × {@code height} pixels: a green board with a dark chip. */
  public static byte[] png(int width, int height) {
    return write("png", width, height);
  }

  /** Returns a JPEG of {@code width} × {@code height} pixels. */
  public static byte[] jpeg(int width, int height) {
    return write("jpeg", width, height);
  }

  private static byte[] write(String format, int width, int height) {
    BufferedImage image = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
    Graphics2D g = image.createGraphics();
    g.setColor(new Color(0x2e, 0x6b, 0x3a));
    g.fillRect(0, 0, width, height);
    g.setColor(new Color(0x22, 0x22, 0x22));
    g.fillRect(width / 3, height / 3, Math.max(1, width / 3), Math.max(1, height / 4));
    g.dispose();
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    try {
      if (!ImageIO.write(image, format, out)) {
        throw new IllegalStateException("no " + format + " writer in this JDK");
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toByteArray();
  }
}
