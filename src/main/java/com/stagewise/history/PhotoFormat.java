package com.stagewise.history;

import java.util.Optional;

/**
 * Recognises the pictures a case may hold (PNG and JPEG) by their first bytes and reads their size
 * in pixels from their headers, without decoding them.
 *
 * <p>PNG: the 8-byte signature, then the IHDR chunk with width and height (PNG specification,
 * ISO/IEC 15948, section 11.2.2). JPEG: the SOI marker FF D8, then marker segments up to a
 * start-of-frame (SOF0–SOF15 except DHT C4, JPG C8 and DAC CC) that holds height and width (ITU-T
 * T.81, annex B).
 */
public final class PhotoFormat {
  /** The media type of a PNG picture. */
  public static final String PNG = "image/png";

  /** The media type of a JPEG picture. */
  public static final String JPEG = "image/jpeg";

  private static final byte[] PNG_SIGNATURE = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n'};

  private PhotoFormat() {}

  /**
   * What a picture file is.
   *
   * @param mediaType {@link #PNG} or {@link #JPEG}
   * @param width width in pixels, 1 or more
   * @param height height in pixels, 1 or more
   */
  public record Picture(String mediaType, int width, int height) {}

  /** Returns what the bytes are, or empty if they are not a PNG or JPEG picture this can read. */
  public static Optional<Picture> of(byte[] bytes) {
    if (startsWith(bytes, PNG_SIGNATURE)) {
      return png(bytes);
    }
    if (bytes.length > 3 && u8(bytes, 0) == 0xff && u8(bytes, 1) == 0xd8) {
      return jpeg(bytes);
    }
    return Optional.empty();
  }

  private static Optional<Picture> png(byte[] b) {
    if (b.length < 24 || b[12] != 'I' || b[13] != 'H' || b[14] != 'D' || b[15] != 'R') {
      return Optional.empty();
    }
    long width = u32(b, 16);
    long height = u32(b, 20);
    return sized(PNG, width, height);
  }

  private static Optional<Picture> jpeg(byte[] b) {
    int at = 2;
    while (at + 3 < b.length) {
      if (u8(b, at) != 0xff) {
        return Optional.empty();
      }
      int marker = u8(b, at + 1);
      if (marker == 0xff) {
        at++; // a fill byte
        continue;
      }
      if (marker == 0x01 || (marker >= 0xd0 && marker <= 0xd8)) {
        at += 2; // markers without a length
        continue;
      }
      if (marker == 0xd9 || marker == 0xda) {
        return Optional.empty(); // end of image or start of scan before any frame header
      }
      int length = u16(b, at + 2);
      boolean frame =
          marker >= 0xc0 && marker <= 0xcf && marker != 0xc4 && marker != 0xc8 && marker != 0xcc;
      if (frame) {
        if (at + 8 >= b.length) {
          return Optional.empty();
        }
        return sized(JPEG, u16(b, at + 7), u16(b, at + 5));
      }
      if (length < 2) {
        return Optional.empty();
      }
      at += 2 + length;
    }
    return Optional.empty();
  }

  private static Optional<Picture> sized(String type, long width, long height) {
    if (width < 1 || height < 1 || width > 100_000 || height > 100_000) {
      return Optional.empty();
    }
    return Optional.of(new Picture(type, (int) width, (int) height));
  }

  private static boolean startsWith(byte[] bytes, byte[] start) {
    if (bytes.length < start.length) {
      return false;
    }
    for (int i = 0; i < start.length; i++) {
      if (bytes[i] != start[i]) {
        return false;
      }
    }
    return true;
  }

  private static int u8(byte[] b, int at) {
    return b[at] & 0xff;
  }

  private static int u16(byte[] b, int at) {
    return (u8(b, at) << 8) | u8(b, at + 1);
  }

  private static long u32(byte[] b, int at) {
    return ((long) u16(b, at) << 16) | u16(b, at + 2);
  }
}
