/**
 * Saves a drawn map as a PNG: the SVG (which carries its own white background, title and
 * colour bar) rendered on a canvas at twice its on-screen size.
 */
export async function saveSvgAsPng(svg: SVGSVGElement, fileName: string): Promise<void> {
  const box = svg.viewBox.baseVal;
  const width = Math.round((svg.clientWidth || 640) * 2);
  const height = Math.round(width * (box.height / box.width));
  const text = new XMLSerializer().serializeToString(svg);
  const url = URL.createObjectURL(new Blob([text], { type: 'image/svg+xml;charset=utf-8' }));
  try {
    const image = new Image();
    image.width = width;
    image.height = height;
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('the map could not be drawn as an image'));
      image.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = width;
    canvas.height = height;
    const context = canvas.getContext('2d');
    if (!context) throw new Error('this browser cannot draw the map as an image');
    context.drawImage(image, 0, 0, width, height);
    const png = await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('no PNG was made'))), 'image/png'),
    );
    const href = URL.createObjectURL(png);
    const a = document.createElement('a');
    a.href = href;
    a.download = fileName;
    document.body.appendChild(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(href), 10_000);
  } finally {
    URL.revokeObjectURL(url);
  }
}
