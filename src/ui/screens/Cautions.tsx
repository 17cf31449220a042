/** Field safety and the limits of the numbers. Shown in the app and mirrored in the README. */
export function CautionsScreen() {
  return (
    <section class="prose">
      <h2>In and near water</h2>
      <ul>
        <li>Work with a partner. Leave a travel plan with your expected return time.</li>
        <li>Wear a personal flotation device in and near water.</li>
        <li>
          Do not wade where depth times velocity reaches about 10 ft²/s (0.93 m²/s), and never sample at flood stage
          (common practice in field manuals).
        </li>
        <li>Cold water and wind cause hypothermia even at air temperatures of 0–10 °C.</li>
        <li>Wash your hands after contact with surface water.</li>
      </ul>
      <h2>Reagents and titrations</h2>
      <ul>
        <li>Wear gloves and eye protection with titrants and kit reagents.</li>
        <li>Always add acid to water, never water to acid. Keep the reagents' safety data sheets with the kit.</li>
      </ul>
      <h2>What the numbers mean</h2>
      <ul>
        <li>
          Saturation indices, CO₂ pressure and the Langelier and Ryznar indices are estimates from your readings and
          published constants. They are guides, not absolutes (Standard Methods 2330).
        </li>
        <li>
          Decisions on drinking-water treatment, corrosion control or public health belong to licensed professionals
          working under local codes. Follow your agency's or client's own procedures where they differ from this app.
        </li>
      </ul>
    </section>
  );
}
