"use client";

import { useThree } from "@react-three/fiber";
import { useEffect, useMemo } from "react";
import * as THREE from "three";
import { FOV_DEG } from "./orbit-rig";

/**
 * A word on the canvas that keeps its size on screen whatever the zoom: text drawn once into
 * a 2D canvas (with a halo in the page colour, so it reads over points), shown as a sprite
 * that always faces the camera and is never hidden behind the sphere.
 */
export function LabelSprite({
  text,
  position,
  colour,
  halo,
  sizePx = 13,
}: {
  text: string;
  position: [number, number, number];
  colour: string;
  halo: string;
  sizePx?: number;
}) {
  const viewportHeight = useThree((state) => state.size.height);
  const dpr = useThree((state) => state.viewport.dpr);
  const { material, aspect, heightPx } = useMemo(() => {
    const canvas = document.createElement("canvas");
    const context = canvas.getContext("2d")!;
    const px = Math.round(sizePx * Math.max(2, dpr));
    const font = `600 ${px}px ${getComputedStyle(document.body).fontFamily || "system-ui, sans-serif"}`;
    context.font = font;
    const pad = Math.ceil(px * 0.35);
    canvas.width = Math.ceil(context.measureText(text).width) + 2 * pad;
    canvas.height = Math.ceil(px * 1.3) + 2 * pad;
    context.font = font;
    context.textBaseline = "middle";
    context.lineJoin = "round";
    context.lineWidth = px * 0.2;
    context.strokeStyle = halo;
    context.strokeText(text, pad, canvas.height / 2);
    context.fillStyle = colour;
    context.fillText(text, pad, canvas.height / 2);
    const texture = new THREE.CanvasTexture(canvas);
    texture.colorSpace = THREE.SRGBColorSpace;
    // Shown near its drawn size: no mipmaps, which would blur the letters.
    texture.generateMipmaps = false;
    texture.minFilter = THREE.LinearFilter;
    const spriteMaterial = new THREE.SpriteMaterial({
      map: texture,
      transparent: true,
      depthTest: false,
      depthWrite: false,
      sizeAttenuation: false,
    });
    return { material: spriteMaterial, aspect: canvas.width / canvas.height, heightPx: (canvas.height * sizePx) / px };
  }, [text, colour, halo, sizePx, dpr]);
  useEffect(
    () => () => {
      material.map?.dispose();
      material.dispose();
    },
    [material],
  );
  // Without size attenuation a sprite of scale s is s·H / (2·tan(fov/2)) pixels high on a canvas H pixels high.
  const height = (2 * Math.tan((FOV_DEG * Math.PI) / 360) * heightPx) / Math.max(1, viewportHeight);
  return <sprite material={material} position={position} scale={[height * aspect, height, 1]} renderOrder={10} />;
}
